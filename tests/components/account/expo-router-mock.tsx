/**
 * expo-router stand-in for component tests: links render their text, navigation is recorded.
 * Use with `jest.mock('expo-router', () => require('./expo-router-mock').expoRouterMock)`.
 */
import { Text } from 'react-native';
import type { ReactNode } from 'react';

export const routerCalls = { push: jest.fn(), replace: jest.fn(), back: jest.fn() };

export const expoRouterMock = {
  Link: ({ children, testID, asChild }: { children: ReactNode; testID?: string; asChild?: boolean }) =>
    asChild ? children : <Text testID={testID}>{children}</Text>,
  useRouter: () => routerCalls,
  useLocalSearchParams: () => ({}),
};

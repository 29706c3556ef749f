import { act, fireEvent, render, screen } from '@testing-library/react-native';
import { Text } from 'react-native';
import { deferred } from '@/components/deferred/deferred';
import { loadScreens } from '@/components/deferred/load-screens';

// The deferred chunk stands in as a tiny module; a test can make its download fail (a dropped connection).
jest.mock('@/components/deferred/load-screens', () => ({ loadScreens: jest.fn() }));
const load = loadScreens as unknown as jest.Mock;
const chunk = { ReviewQueueScreen: () => <Text testID="queue-loaded">review queue</Text> };

beforeEach(() => {
  load.mockReset();
  load.mockResolvedValue(chunk);
});
afterEach(() => {
  jest.useRealTimers();
});

it('shows the screen once its chunk has loaded', async () => {
  const ReviewQueueScreen = deferred('ReviewQueueScreen');
  render(<ReviewQueueScreen />);
  expect(await screen.findByTestId('queue-loaded')).toHaveTextContent('review queue');
});

it('says "Opening…" only when the download takes longer than a blink', () => {
  jest.useFakeTimers();
  load.mockReturnValue(new Promise(() => undefined)); // never arrives
  const ReviewQueueScreen = deferred('ReviewQueueScreen');
  render(<ReviewQueueScreen />);
  expect(screen.getByTestId('deferred-loading')).toBeTruthy();
  expect(screen.queryByText('Opening…')).toBeNull();
  act(() => jest.advanceTimersByTime(450));
  expect(screen.getByText('Opening…')).toBeTruthy();
});

it('explains a failed download and loads the screen on "Try again"', async () => {
  load.mockRejectedValueOnce(new Error('Loading chunk failed'));
  const silence = jest.spyOn(console, 'error').mockImplementation(() => undefined);
  const ReviewQueueScreen = deferred('ReviewQueueScreen');
  render(<ReviewQueueScreen />);
  expect(await screen.findByTestId('deferred-failed')).toHaveTextContent(/could not be loaded/);
  fireEvent.press(screen.getByTestId('deferred-retry'));
  expect(await screen.findByTestId('queue-loaded')).toBeTruthy();
  expect(load).toHaveBeenCalledTimes(2);
  silence.mockRestore();
});

it('a quiet card shows nothing when its chunk fails, and the page around it stays', async () => {
  load.mockRejectedValueOnce(new Error('Loading chunk failed'));
  const silence = jest.spyOn(console, 'error').mockImplementation(() => undefined);
  const Card = deferred('ReviewQueueScreen', { fallback: null });
  render(
    <>
      <Text testID="around">verdict</Text>
      <Card />
    </>,
  );
  await act(async () => {
    await new Promise((resolve) => setTimeout(resolve, 50));
  });
  expect(load).toHaveBeenCalled();
  expect(screen.getByTestId('around')).toBeTruthy();
  expect(screen.queryByTestId('deferred-failed')).toBeNull();
  expect(screen.queryByTestId('queue-loaded')).toBeNull();
  silence.mockRestore();
});

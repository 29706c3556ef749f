import { loadAsync } from 'expo-font';
import { fontFiles } from './theme';

let loading: Promise<void> | null = null;

/**
 * Starts loading the shipped fonts (once) and resolves when they are in, or have failed and the
 * system fonts stand in; it never rejects. The routes stay hidden until then (app/_layout.tsx).
 */
export function fontsLoaded(): Promise<void> {
  loading ??= loadAsync(fontFiles).then(
    () => undefined,
    () => undefined,
  );
  return loading;
}

import { loadAsync } from 'expo-font';
import { fontFiles } from './theme';

let loading: Promise<void> | null = null;

/**
 * Starts loading the shipped fonts (once) and resolves when they are in, or have failed and the
 * system fonts stand in; it never rejects. The routes stay hidden until then (app/_layout.tsx).
 */
export function loadFonts(): Promise<void> {
  loading ??= loadAsync(fontFiles).then(
    () => undefined,
    () => undefined,
  );
  return loading;
}

let shownGate: { promise: Promise<void>; open: () => void } | null = null;

/**
 * Called once by the root layout, which hides the routes until the fonts are in: from then on
 * `routesShown()` waits for `markRoutesShown()`. Without a layout (component tests) it does not wait.
 */
export function holdUntilRoutesShown(): void {
  if (shownGate) return;
  let open: () => void = () => undefined;
  const promise = new Promise<void>((resolve) => (open = resolve));
  shownGate = { promise, open };
}

/** The root layout has committed the frame in which the routes are visible. */
export function markRoutesShown(): void {
  shownGate?.open();
}

export function routesShown(): Promise<void> {
  return shownGate?.promise ?? Promise.resolve();
}

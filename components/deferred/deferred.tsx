import { Component, lazy, Suspense, useEffect, useState, type ComponentProps, type ComponentType, type ReactNode } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { routesShown } from '@/components/ui/font-loading';
import { colors, spacing } from '@/components/ui/theme';
import { loadScreens } from './load-screens';
import type * as Screens from './screens';

type ScreenName = keyof typeof Screens;

interface DeferredOptions {
  /** Shown until the chunk arrives: by default the page ground, with a loading note if it takes a while. */
  fallback?: ReactNode;
  /**
   * Ask for the chunk only once the view around it has painted, so a card that is not part of the
   * first answer never competes with it for the network and the main thread.
   */
  afterPaint?: boolean;
}

/** A view from ./screens, loaded the first time it renders (see there for why they share one chunk). */
export function deferred<Name extends ScreenName>(name: Name, { fallback = <LoadingPage />, afterPaint = false }: DeferredOptions = {}) {
  // The props are checked where Deferred is used; inside, the loaded view takes them as they come.
  // A failed download (offline, a new release replaced the chunk) is retried with a fresh lazy().
  const load = () =>
    lazy(async () => {
      const screens = await loadScreens();
      return { default: screens[name] as unknown as ComponentType<object> };
    });
  let Loaded = load();
  function Deferred(props: ComponentProps<(typeof Screens)[Name]>) {
    const painted = usePainted(!afterPaint);
    const [attempt, setAttempt] = useState(0);
    if (!painted) return fallback;
    const retry = () => {
      Loaded = load();
      setAttempt((n) => n + 1);
    };
    return (
      <LoadFailure key={attempt} quiet={fallback === null} onRetry={retry}>
        <Suspense fallback={fallback}>
          <Loaded {...(props as object)} />
        </Suspense>
      </LoadFailure>
    );
  }
  Deferred.displayName = `Deferred(${name})`;
  return Deferred;
}

/**
 * Fetches the deferred chunk in the background once the calling view has painted, so the first tab
 * opened from it does not wait for the download. A failure is left to the view that needs the chunk.
 */
export function usePreloadDeferredScreens(): void {
  const painted = usePainted(false);
  useEffect(() => {
    if (painted) loadScreens().catch(() => undefined);
  }, [painted]);
}

/**
 * False until the first render has reached the screen (the frame after it is committed, once the
 * fonts are in and the routes are shown), then true.
 */
function usePainted(already: boolean): boolean {
  const [painted, setPainted] = useState(already);
  useEffect(() => {
    if (painted) return;
    let cancelled = false;
    let frame: number | undefined;
    let timer: ReturnType<typeof setTimeout> | undefined;
    // The routes stay hidden until the fonts are in (app/_layout.tsx): a frame before that showed nothing.
    void routesShown().then(() => {
        if (cancelled) return;
        frame = requestAnimationFrame(() => {
          timer = setTimeout(() => setPainted(true), 0);
        });
      });
    return () => {
      cancelled = true;
      if (frame !== undefined) cancelAnimationFrame(frame);
      if (timer !== undefined) clearTimeout(timer);
    };
  }, [painted]);
  return painted;
}

/** The page ground; a quiet "Opening…" only if the download takes longer than a blink. */
function LoadingPage() {
  const [slow, setSlow] = useState(false);
  useEffect(() => {
    const timer = setTimeout(() => setSlow(true), 400);
    return () => clearTimeout(timer);
  }, []);
  return (
    <View style={styles.page} testID="deferred-loading">
      {slow ? (
        <View style={styles.note} accessibilityRole="progressbar" accessibilityLabel="Opening this screen">
          <ActivityIndicator color={colors.ink} />
          <AppText tone="soft">Opening…</AppText>
        </View>
      ) : null}
    </View>
  );
}

/**
 * When the screen's code cannot be fetched: say so and offer to try again. `quiet` (a card that
 * shows nothing while it loads) shows nothing on failure either: the page around it still works.
 */
class LoadFailure extends Component<{ quiet: boolean; onRetry: () => void; children: ReactNode }, { failed: boolean }> {
  state = { failed: false };

  static getDerivedStateFromError() {
    return { failed: true };
  }

  render() {
    if (!this.state.failed) return this.props.children;
    if (this.props.quiet) return null;
    return (
      <View style={styles.page} testID="deferred-failed">
        <View style={styles.note}>
          <AppText>This screen could not be loaded. Check the connection to the Sphereline server.</AppText>
          <Button label="Try again" onPress={this.props.onRetry} testID="deferred-retry" />
        </View>
      </View>
    );
  }
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.paper },
  note: { alignItems: 'center', gap: spacing.md, padding: spacing.xl },
});

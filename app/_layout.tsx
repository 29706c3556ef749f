import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Slot } from 'expo-router';
import { useEffect } from 'react';
import { StyleSheet, View } from 'react-native';
import { queryClient } from '@/lib/api/query-client';
import { holdUntilRoutesShown, loadFonts, markRoutesShown } from '@/components/ui/font-loading';
import { fontFiles } from '@/components/ui/theme';
import { ToastProvider } from '@/components/ui/toast';
import { installFocusRing } from '@/components/ui/focus-ring';

// Ask for the shipped fonts as soon as this module runs, before anything renders; useFonts below joins
// the same requests (expo-font keeps one load per family) and reports the outcome, errors included.
holdUntilRoutesShown();
installFocusRing();
void loadFonts();

export default function RootLayout() {
  // Fonts ship with the app (assets/fonts); an error falls back to system fonts rather than a blank page.
  const [fontsLoaded, fontError] = useFonts(fontFiles);
  const fontsSettled = fontsLoaded || !!fontError;
  // Views that wait for the first visible frame (deferred cards) start once this has committed.
  useEffect(() => {
    if (fontsSettled) markRoutesShown();
  }, [fontsSettled]);
  // The routes render hidden while the fonts load, so the screen's own chunk downloads beside the fonts
  // rather than after them; nothing shows before the fonts are in, as before.
  return (
    <QueryClientProvider client={queryClient}>
      <View style={fontsSettled ? styles.shown : styles.waitingForFonts}>
        <ToastProvider>
          <Slot />
        </ToastProvider>
      </View>
    </QueryClientProvider>
  );
}

const styles = StyleSheet.create({
  shown: { flex: 1 },
  waitingForFonts: { flex: 1, display: 'none' },
});

import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Slot } from 'expo-router';
import { queryClient } from '@/lib/api/query-client';
import { fontFiles } from '@/components/ui/theme';

export default function RootLayout() {
  // Fonts ship with the app (assets/fonts); an error falls back to system fonts rather than a blank page.
  const [fontsLoaded, fontError] = useFonts(fontFiles);
  if (!fontsLoaded && !fontError) return null;
  return (
    <QueryClientProvider client={queryClient}>
      <Slot />
    </QueryClientProvider>
  );
}

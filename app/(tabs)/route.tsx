import { useLocalSearchParams, useRouter } from 'expo-router';
import { useCallback } from 'react';
import { deferred } from '@/components/deferred/deferred';
import { PageTitle } from '@/components/ui/page-title';

const RouteScreen = deferred('RouteScreen');

/** /route?oxidant=…&reductant=… opens with the pair filled in. */
export default function Route() {
  const { oxidant, reductant } = useLocalSearchParams<{ oxidant?: string; reductant?: string }>();
  const router = useRouter();
  const keepInAddress = useCallback(
    (ox: string, red: string) => router.setParams({ oxidant: ox || undefined, reductant: red || undefined }),
    [router],
  );
  const ox = typeof oxidant === 'string' ? oxidant.trim() : '';
  const red = typeof reductant === 'string' ? reductant.trim() : '';
  return (
    <>
      <PageTitle parts={[ox && red ? `${ox} + ${red}` : ox || red, 'Route']} />
      <RouteScreen
      initialOxidant={typeof oxidant === 'string' ? oxidant : ''}
      initialReductant={typeof reductant === 'string' ? reductant : ''}
      onPairSettled={keepInAddress}
      />
    </>
  );
}

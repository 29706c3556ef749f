import { useLocalSearchParams, useRouter } from 'expo-router';
import { useCallback } from 'react';
import { CheckScreen } from '@/components/check/check-screen';
import { formulaFromAddress } from '@/components/check/formula-from-address';

/** /check?formula=<urlencoded> opens with the result shown; typing keeps the address shareable. */
export default function Check() {
  const { formula } = useLocalSearchParams<{ formula?: string }>();
  const router = useRouter();
  const keepInAddress = useCallback(
    (settled: string) => router.setParams({ formula: settled || undefined }),
    [router],
  );
  return <CheckScreen initialFormula={formulaFromAddress(typeof formula === 'string' ? formula : undefined)} onFormulaSettled={keepInAddress} />;
}

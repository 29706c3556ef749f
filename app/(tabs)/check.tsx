import { useLocalSearchParams, useRouter } from 'expo-router';
import { useCallback } from 'react';
import { CheckScreen } from '@/components/check/check-screen';
import { formulaFromAddress } from '@/components/check/formula-from-address';
import { PageTitle } from '@/components/ui/page-title';

/** /check?formula=<urlencoded> opens with the result shown; typing keeps the address shareable. */
export default function Check() {
  const { formula } = useLocalSearchParams<{ formula?: string }>();
  const router = useRouter();
  const keepInAddress = useCallback(
    (settled: string) => router.setParams({ formula: settled || undefined }),
    [router],
  );
  const initialFormula = formulaFromAddress(typeof formula === 'string' ? formula : undefined);
  return (
    <>
      {/* The address follows the settled formula, so the title names what is on screen. */}
      <PageTitle parts={[initialFormula, 'Check']} />
      <CheckScreen initialFormula={initialFormula} onFormulaSettled={keepInAddress} />
    </>
  );
}

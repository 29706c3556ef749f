import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { PageTitle } from '@/components/ui/page-title';
import { firstParam } from '@/components/ui/route-params';

const VerifyScreen = deferred('VerifyScreen');

export default function Verify() {
  const { token } = useLocalSearchParams<{ token?: string | string[] }>();
  return (
    <>
      <PageTitle parts={['Confirm your e-mail']} />
      <VerifyScreen token={firstParam(token)} />
    </>
  );
}

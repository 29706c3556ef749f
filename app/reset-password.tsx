import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { PageTitle } from '@/components/ui/page-title';
import { firstParam } from '@/components/ui/route-params';

const ResetPasswordScreen = deferred('ResetPasswordScreen');

export default function ResetPassword() {
  const { token } = useLocalSearchParams<{ token?: string | string[] }>();
  return (
    <>
      <PageTitle parts={['Choose a new password']} />
      <ResetPasswordScreen token={firstParam(token)} />
    </>
  );
}

import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { firstParam } from '@/components/ui/route-params';

const ResetPasswordScreen = deferred('ResetPasswordScreen');

export default function ResetPassword() {
  const { token } = useLocalSearchParams<{ token?: string | string[] }>();
  return <ResetPasswordScreen token={firstParam(token)} />;
}

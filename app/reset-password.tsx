import { useLocalSearchParams } from 'expo-router';
import { firstParam } from '@/components/account/form-errors';
import { ResetPasswordScreen } from '@/components/account/reset-password-screen';

export default function ResetPassword() {
  const { token } = useLocalSearchParams<{ token?: string | string[] }>();
  return <ResetPasswordScreen token={firstParam(token)} />;
}

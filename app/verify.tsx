import { useLocalSearchParams } from 'expo-router';
import { firstParam } from '@/components/account/form-errors';
import { VerifyScreen } from '@/components/account/verify-screen';

export default function Verify() {
  const { token } = useLocalSearchParams<{ token?: string | string[] }>();
  return <VerifyScreen token={firstParam(token)} />;
}

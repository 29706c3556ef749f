import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { firstParam } from '@/components/ui/route-params';

const VerifyScreen = deferred('VerifyScreen');

export default function Verify() {
  const { token } = useLocalSearchParams<{ token?: string | string[] }>();
  return <VerifyScreen token={firstParam(token)} />;
}

import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { firstParam } from '@/components/ui/route-params';

const AcceptInvitationScreen = deferred('AcceptInvitationScreen');

export default function AcceptInvitation() {
  const { token } = useLocalSearchParams<{ token?: string | string[] }>();
  return <AcceptInvitationScreen token={firstParam(token)} />;
}

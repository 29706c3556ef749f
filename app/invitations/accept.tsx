import { useLocalSearchParams } from 'expo-router';
import { firstParam } from '@/components/account/form-errors';
import { AcceptInvitationScreen } from '@/components/account/accept-invitation-screen';

export default function AcceptInvitation() {
  const { token } = useLocalSearchParams<{ token?: string | string[] }>();
  return <AcceptInvitationScreen token={firstParam(token)} />;
}

import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { PageTitle } from '@/components/ui/page-title';
import { firstParam } from '@/components/ui/route-params';

const AcceptInvitationScreen = deferred('AcceptInvitationScreen');

export default function AcceptInvitation() {
  const { token } = useLocalSearchParams<{ token?: string | string[] }>();
  return (
    <>
      <PageTitle parts={['Invitation']} />
      <AcceptInvitationScreen token={firstParam(token)} />
    </>
  );
}

import { deferred } from '@/components/deferred/deferred';

const AccountScreen = deferred('AccountScreen');

export default function Account() {
  return <AccountScreen />;
}

import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { PageTitle } from '@/components/ui/page-title';
import { firstParam } from '@/components/ui/route-params';

const SignInScreen = deferred('SignInScreen');

export default function SignIn() {
  const { next, email } = useLocalSearchParams<{ next?: string | string[]; email?: string | string[] }>();
  return (
    <>
      <PageTitle parts={['Sign in']} />
      <SignInScreen next={firstParam(next) || undefined} email={firstParam(email) || undefined} />
    </>
  );
}

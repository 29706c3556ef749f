import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { PageTitle } from '@/components/ui/page-title';
import { firstParam } from '@/components/ui/route-params';

const SignUpScreen = deferred('SignUpScreen');

export default function SignUp() {
  const { next, email } = useLocalSearchParams<{ next?: string | string[]; email?: string | string[] }>();
  return (
    <>
      <PageTitle parts={['Create an account']} />
      <SignUpScreen next={firstParam(next) || undefined} email={firstParam(email) || undefined} />
    </>
  );
}

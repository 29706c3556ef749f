import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { firstParam } from '@/components/ui/route-params';

const SignUpScreen = deferred('SignUpScreen');

export default function SignUp() {
  const { next, email } = useLocalSearchParams<{ next?: string | string[]; email?: string | string[] }>();
  return <SignUpScreen next={firstParam(next) || undefined} email={firstParam(email) || undefined} />;
}

import { useLocalSearchParams } from 'expo-router';
import { firstParam } from '@/components/account/form-errors';
import { SignUpScreen } from '@/components/account/sign-up-screen';

export default function SignUp() {
  const { next, email } = useLocalSearchParams<{ next?: string | string[]; email?: string | string[] }>();
  return <SignUpScreen next={firstParam(next) || undefined} email={firstParam(email) || undefined} />;
}

import { useLocalSearchParams } from 'expo-router';
import { firstParam } from '@/components/account/form-errors';
import { SignInScreen } from '@/components/account/sign-in-screen';

export default function SignIn() {
  const { next, email } = useLocalSearchParams<{ next?: string | string[]; email?: string | string[] }>();
  return <SignInScreen next={firstParam(next) || undefined} email={firstParam(email) || undefined} />;
}

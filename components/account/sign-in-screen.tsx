import { useRouter } from 'expo-router';
import { AuthFrame, LinkRow, TextLink } from './auth-frame';
import { safeNextPath } from './form-errors';
import { SignInForm } from './sign-in-form';

/** Sign in, then go where the person was heading (?next=) or to the Account tab. */
export function SignInScreen({ next, email }: { next?: string; email?: string }) {
  const router = useRouter();
  const target = safeNextPath(next);
  const carry = (path: string) => {
    const params = new URLSearchParams();
    if (next) params.set('next', target);
    if (email) params.set('email', email);
    const query = params.toString();
    return query ? `${path}?${query}` : path;
  };
  return (
    <AuthFrame
      title="Sign in"
      intro="Your group’s library, reviews and roles need an account. Check and Route work without one."
      testID="sign-in-screen"
    >
      <SignInForm
        initialEmail={email}
        onSignedIn={() => router.replace(target)}
        footer={
          <LinkRow>
            <TextLink href={carry('/sign-up')} testID="sign-in-to-sign-up">Create an account</TextLink>
            <TextLink href="/forgot-password" testID="sign-in-to-forgot">Forgot your password?</TextLink>
          </LinkRow>
        }
      />
    </AuthFrame>
  );
}

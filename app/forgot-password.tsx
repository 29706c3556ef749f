import { deferred } from '@/components/deferred/deferred';
import { PageTitle } from '@/components/ui/page-title';

const ForgotPasswordScreen = deferred('ForgotPasswordScreen');

export default function ForgotPassword() {
  return (
    <>
      <PageTitle parts={['Forgot password']} />
      <ForgotPasswordScreen />
    </>
  );
}

import { deferred } from '@/components/deferred/deferred';

const ForgotPasswordScreen = deferred('ForgotPasswordScreen');

export default function ForgotPassword() {
  return <ForgotPasswordScreen />;
}

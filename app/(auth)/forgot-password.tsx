/** /forgot-password: ask for a password-reset link. */
import { ForgotPasswordScreen } from '../../components/password-reset/forgot-password-screen';

export default function ForgotPasswordRoute() {
  return <ForgotPasswordScreen />;
}

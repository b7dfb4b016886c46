/** /sign-up: the account form; a new account gets its own shop. */
import { SignUpScreen } from '../../components/auth/sign-up-screen';

export default function SignUpRoute() {
  return <SignUpScreen />;
}

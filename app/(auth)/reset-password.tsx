/** /reset-password?token=...: choose a new password with the link from the reset e-mail. */
import { useLocalSearchParams } from 'expo-router';
import { ResetPasswordScreen } from '../../components/password-reset/reset-password-screen';

export default function ResetPasswordRoute() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return <ResetPasswordScreen token={typeof token === 'string' && token !== '' ? token : null} />;
}

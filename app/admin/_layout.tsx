/** Site admin area: signed-out visitors go to sign in, signed-in people who are not site admins go home. */
import { Redirect, Slot } from 'expo-router';
import { SessionProblem } from '../../components/nav/session-problem';
import { Loading } from '../../components/ui/loading';
import { useMe } from '../../hooks/use-me';

export default function AdminLayout() {
  const me = useMe();
  if (me.isPending) return <Loading label="Checking your sign-in" />;
  if (me.error) return <SessionProblem message={me.error.message} onRetry={() => me.refetch()} />;
  if (!me.data) return <Redirect href="/sign-in" />;
  if (!me.data.user.isAdmin) return <Redirect href="/" />;
  return <Slot />;
}

/** Signed-out area: a person who is already signed in goes straight to the builds list. */
import { Redirect, Slot } from 'expo-router';
import { SessionProblem } from '../../components/nav/session-problem';
import { Loading } from '../../components/ui/loading';
import { useMe } from '../../hooks/use-me';

export default function AuthLayout() {
  const me = useMe();
  if (me.isPending) return <Loading label="Checking your sign-in" />;
  if (me.error) return <SessionProblem message={me.error.message} onRetry={() => me.refetch()} />;
  if (me.data) return <Redirect href="/builds" />;
  return <Slot />;
}

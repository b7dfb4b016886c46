/** Signed-in area: anonymous visitors are sent to sign in; members get the navigation and their current shop. */
import { Redirect, Slot } from 'expo-router';
import { AppFrame } from '../../components/nav/app-frame';
import { SessionProblem } from '../../components/nav/session-problem';
import { Loading } from '../../components/ui/loading';
import { CurrentShopProvider } from '../../hooks/current-shop';
import { useMe } from '../../hooks/use-me';

export default function ShopLayout() {
  const me = useMe();
  if (me.isPending) return <Loading label="Checking your sign-in" />;
  if (me.error) return <SessionProblem message={me.error.message} onRetry={() => me.refetch()} />;
  if (!me.data) return <Redirect href="/sign-in" />;
  return (
    <CurrentShopProvider memberships={me.data.memberships}>
      <AppFrame user={me.data.user}>
        <Slot />
      </AppFrame>
    </CurrentShopProvider>
  );
}

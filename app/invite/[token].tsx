/** /invite/<token>: the page an invitation e-mail links to (open to visitors and signed-in people alike). */
import { useLocalSearchParams } from 'expo-router';
import { InviteScreen } from '../../components/invitations/invite-screen';

export default function InviteRoute() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return <InviteScreen token={String(token ?? '')} />;
}

/** /members: crew and clients of the current shop. */
import { MembersScreen } from '../../components/members/members-screen';

export default function MembersRoute() {
  return <MembersScreen />;
}

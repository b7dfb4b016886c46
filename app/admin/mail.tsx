/** /admin/mail: site admin view of mail. */
import { AdminMailScreen } from '../../components/admin/admin-mail-screen';

export default function AdminMailRoute() {
  return <AdminMailScreen />;
}

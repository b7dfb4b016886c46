/** /admin/shops: site admin view of shops. */
import { AdminShopsScreen } from '../../components/admin/admin-shops-screen';

export default function AdminShopsRoute() {
  return <AdminShopsScreen />;
}

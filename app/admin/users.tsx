/** /admin/users: site admin view of users. */
import { AdminUsersScreen } from '../../components/admin/admin-users-screen';

export default function AdminUsersRoute() {
  return <AdminUsersScreen />;
}

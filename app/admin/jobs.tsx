/** /admin/jobs: site admin view of jobs. */
import { AdminJobsScreen } from '../../components/admin/admin-jobs-screen';

export default function AdminJobsRoute() {
  return <AdminJobsScreen />;
}

/** /admin: opens the first admin section. */
import { Redirect } from 'expo-router';

export default function AdminIndexRoute() {
  return <Redirect href="/admin/users" />;
}

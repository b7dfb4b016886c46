/** /admin/orders: site admin view of orders. */
import { AdminOrdersScreen } from '../../components/admin/admin-orders-screen';

export default function AdminOrdersRoute() {
  return <AdminOrdersScreen />;
}

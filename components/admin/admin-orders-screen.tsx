/** Admin: pattern-pack orders, newest first, by status and searchable by buyer or pack title. */
import { useState } from 'react';
import { ADMIN_PAGE_SIZE, useAdminOrders, type AdminOrder, type OrderStatus } from '../../hooks/use-admin';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { AdminFrame } from './admin-frame';
import { adminMoney, adminTime } from './admin-format';
import { AdminList, type AdminColumn } from './admin-list';
import { AdminSearch } from './admin-search';

const STATUSES: readonly OrderStatus[] = ['paid', 'pending', 'refunded'];

const columns: AdminColumn<AdminOrder>[] = [
  { label: 'Placed', flex: 2, render: (o) => adminTime(o.createdAt) },
  { label: 'Buyer', flex: 3, render: (o) => o.email },
  { label: 'Pack', flex: 3, render: (o) => o.pack.title },
  { label: 'Shop', flex: 2, render: (o) => o.shop.name },
  { label: 'Amount', flex: 1, render: (o) => adminMoney(o.amountCents, o.currency) },
  { label: 'Status', flex: 1, render: (o) => o.status },
];

/** Renders the orders list with status filter, search and paging. */
export function AdminOrdersScreen() {
  const [q, setQ] = useState('');
  const [status, setStatus] = useState<OrderStatus | null>(null);
  const [page, setPage] = useState(1);
  const orders = useAdminOrders(q.trim(), status, page);
  return (
    <AdminFrame title="Orders">
      <AdminSearch
        label="Search orders"
        q={q}
        onQ={(v) => { setQ(v); setPage(1); }}
        choices={STATUSES}
        value={status}
        onChoice={(s) => { setStatus(s); setPage(1); }}
      />
      {orders.error ? <Notice tone="error" title="The list could not be loaded">{orders.error.message}</Notice> : null}
      {orders.data ? (
        <AdminList caption="Orders" columns={columns} rows={orders.data.orders} rowKey={(o) => o.id} empty="No order matches." page={page} pageSize={ADMIN_PAGE_SIZE} total={orders.data.total} onPage={setPage} />
      ) : orders.isPending ? (
        <Loading label="Loading orders" />
      ) : null}
    </AdminFrame>
  );
}

/** Admin: pattern-pack orders, newest first, by status and searchable by buyer or pack title. */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ADMIN_PAGE_SIZE, useAdminOrders, useRefundOrder, type AdminOrder, type OrderStatus } from '../../hooks/use-admin';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { AdminFrame } from './admin-frame';
import { adminMoney, adminTime } from './admin-format';
import { AdminList, type AdminColumn } from './admin-list';
import { AdminSearch } from './admin-search';

const STATUSES: readonly OrderStatus[] = ['paid', 'pending', 'refunded'];

/** Refund with a confirming second press: a refund cannot be undone and ends the buyer's download links. */
function RefundCell({ order }: { order: AdminOrder }) {
  const refund = useRefundOrder();
  const [asking, setAsking] = useState(false);
  if (order.status !== 'paid') return <Text variant="small">—</Text>;
  return (
    <View style={styles.refund}>
      {asking ? (
        <>
          <Button label="Confirm refund" compact tone="danger" busy={refund.isPending} accessibilityLabel={`Confirm refund of ${order.email}'s order`} onPress={() => refund.mutate(order.id)} />
          <Button label="Keep" compact tone="quiet" accessibilityLabel="Keep the order" onPress={() => setAsking(false)} />
        </>
      ) : (
        <Button label="Refund" compact tone="secondary" accessibilityLabel={`Refund ${order.email}'s order`} onPress={() => setAsking(true)} />
      )}
      {refund.error ? <Text variant="small" style={styles.error}>{refund.error.message}</Text> : null}
    </View>
  );
}

const columns: AdminColumn<AdminOrder>[] = [
  { label: 'Placed', flex: 2, render: (o) => adminTime(o.createdAt) },
  { label: 'Buyer', flex: 3, render: (o) => o.email },
  { label: 'Pack', flex: 3, render: (o) => o.pack.title },
  { label: 'Shop', flex: 2, render: (o) => o.shop.name },
  { label: 'Amount', flex: 1, render: (o) => adminMoney(o.amountCents, o.currency) },
  { label: 'Status', flex: 1, render: (o) => o.status },
  { label: 'Action', flex: 2, render: (o) => <RefundCell order={o} /> },
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

const styles = StyleSheet.create({
  refund: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, alignItems: 'center' },
  error: { color: palette.danger },
});

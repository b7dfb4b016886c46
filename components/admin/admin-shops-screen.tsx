/** Admin: every shop with its members, builds and owners, searchable by name. */
import { useState } from 'react';
import { ADMIN_PAGE_SIZE, useAdminShops, type AdminShop } from '../../hooks/use-admin';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { AdminFrame } from './admin-frame';
import { adminTime } from './admin-format';
import { AdminList, type AdminColumn } from './admin-list';
import { AdminSearch } from './admin-search';

const columns: AdminColumn<AdminShop>[] = [
  { label: 'Shop', flex: 3, render: (s) => s.name },
  { label: 'Owners', flex: 3, render: (s) => (s.ownerEmails.length ? s.ownerEmails.join(', ') : '—') },
  { label: 'Members', flex: 1, render: (s) => s.memberCount },
  { label: 'Builds', flex: 1, render: (s) => s.buildCount },
  { label: 'Opened', flex: 2, render: (s) => adminTime(s.createdAt) },
];

/** Renders the shops list with search and paging. */
export function AdminShopsScreen() {
  const [q, setQ] = useState('');
  const [page, setPage] = useState(1);
  const shops = useAdminShops(q.trim(), page);
  return (
    <AdminFrame title="Shops">
      <AdminSearch label="Search shops" q={q} onQ={(v) => { setQ(v); setPage(1); }} />
      {shops.error ? <Notice tone="error" title="The list could not be loaded">{shops.error.message}</Notice> : null}
      {shops.data ? (
        <AdminList caption="Shops" columns={columns} rows={shops.data.shops} rowKey={(s) => s.id} empty="No shop matches." page={page} pageSize={ADMIN_PAGE_SIZE} total={shops.data.total} onPage={setPage} />
      ) : shops.isPending ? (
        <Loading label="Loading shops" />
      ) : null}
    </AdminFrame>
  );
}

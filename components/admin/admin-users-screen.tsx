/** Admin: everyone with an account, searchable by e-mail or name. */
import { useState } from 'react';
import { ADMIN_PAGE_SIZE, useAdminUsers, type AdminUser } from '../../hooks/use-admin';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { AdminFrame } from './admin-frame';
import { adminTime } from './admin-format';
import { AdminList, type AdminColumn } from './admin-list';
import { AdminSearch } from './admin-search';

const columns: AdminColumn<AdminUser>[] = [
  { label: 'Name', flex: 2, render: (u) => u.name },
  { label: 'E-mail', flex: 3, render: (u) => u.email },
  { label: 'Shops', flex: 1, render: (u) => u.shopCount },
  { label: 'Site admin', flex: 1, render: (u) => (u.isAdmin ? 'yes' : 'no') },
  { label: 'Joined', flex: 2, render: (u) => adminTime(u.createdAt) },
];

/** Renders the people list with search and paging. */
export function AdminUsersScreen() {
  const [q, setQ] = useState('');
  const [page, setPage] = useState(1);
  const users = useAdminUsers(q.trim(), page);
  return (
    <AdminFrame title="People">
      <AdminSearch label="Search people" q={q} onQ={(v) => { setQ(v); setPage(1); }} />
      {users.error ? <Notice tone="error" title="The list could not be loaded">{users.error.message}</Notice> : null}
      {users.data ? (
        <AdminList caption="People" columns={columns} rows={users.data.users} rowKey={(u) => u.id} empty="Nobody matches." page={page} pageSize={ADMIN_PAGE_SIZE} total={users.data.total} onPage={setPage} />
      ) : users.isPending ? (
        <Loading label="Loading people" />
      ) : null}
    </AdminFrame>
  );
}

/** Admin: the job queue (failed first by default), with the error a failed job ended with and a Retry button. */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ADMIN_PAGE_SIZE, JOB_STATE_FILTERS, useAdminJobs, useRetryJob, type AdminJob, type JobStateFilter } from '../../hooks/use-admin';
import { Button } from '../ui/button';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import { AdminFrame } from './admin-frame';
import { adminTime } from './admin-format';
import { AdminList, type AdminColumn } from './admin-list';
import { AdminSearch } from './admin-search';

function RetryCell({ job }: { job: AdminJob }) {
  const retry = useRetryJob();
  if (job.state !== 'failed') return <Text variant="small">—</Text>;
  return (
    <View style={styles.retry}>
      <Button label="Retry" compact tone="secondary" busy={retry.isPending} accessibilityLabel={`Retry job ${job.name} ${job.id.slice(0, 8)}`} onPress={() => retry.mutate(job.id)} />
      {retry.error ? <Text variant="small" style={styles.error}>{retry.error.message}</Text> : null}
    </View>
  );
}

const columns: AdminColumn<AdminJob>[] = [
  { label: 'Job', flex: 2, render: (j) => j.name },
  { label: 'State', flex: 1, render: (j) => j.state },
  // pg-boss counts retries; people count attempts (a job that has started has had retryCount + 1).
  { label: 'Attempts', flex: 1, render: (j) => `${j.startedAt ? j.retryCount + 1 : j.retryCount} of ${j.retryLimit + 1}` },
  { label: 'Created', flex: 2, render: (j) => adminTime(j.createdAt) },
  { label: 'Ended', flex: 2, render: (j) => adminTime(j.completedAt) },
  { label: 'Error', flex: 4, render: (j) => (j.error ? <Text variant="small" style={styles.error}>{j.error}</Text> : '—') },
  { label: 'Action', flex: 2, render: (j) => <RetryCell job={j} /> },
];

/** Renders the jobs list with a state filter (failed by default), paging and retry for failed jobs. */
export function AdminJobsScreen() {
  const [state, setState] = useState<JobStateFilter | null>('failed');
  const [page, setPage] = useState(1);
  const jobs = useAdminJobs(state, page);
  return (
    <AdminFrame title="Jobs">
      <AdminSearch label="Job state" choices={JOB_STATE_FILTERS} value={state} onChoice={(s) => { setState(s); setPage(1); }} />
      {jobs.error ? <Notice tone="error" title="The queue could not be read">{jobs.error.message}</Notice> : null}
      {jobs.data ? (
        <AdminList caption="Jobs" columns={columns} rows={jobs.data.jobs} rowKey={(j) => j.id} empty={state === 'failed' ? 'No failed jobs.' : 'No jobs in this state.'} page={page} pageSize={ADMIN_PAGE_SIZE} total={jobs.data.total} onPage={setPage} />
      ) : jobs.isPending ? (
        <Loading label="Loading jobs" />
      ) : null}
    </AdminFrame>
  );
}

const styles = StyleSheet.create({
  retry: { gap: space.xs, alignItems: 'flex-start' },
  error: { color: palette.danger },
});

/**
 * What the site admin screens may do to queued work: put a failed job back on its queue. Kept apart from
 * JobSender so request handlers that only queue work cannot retry or inspect others' jobs.
 */
import type PgBoss from 'pg-boss';

export interface JobAdmin {
  /** Puts failed job `id` of queue `name` back to be run again; a job that is not failed is left as it is. */
  retry(name: string, id: string): Promise<void>;
}

/** Returns a JobAdmin over a started pg-boss instance (pg-boss `retry`: state failed → retry, one more attempt allowed). */
export function pgBossJobAdmin(boss: PgBoss): JobAdmin {
  return {
    retry: (name, id) => boss.retry(name, id),
  };
}

/**
 * How the API puts work on the queue. Request handlers see only `JobSender`; the pg-boss implementation
 * makes sure the job type's queue exists (with its options from job-types.ts) before the first send, so the
 * API can accept work even before any worker has started.
 */
import type PgBoss from 'pg-boss';
import { JOB_TYPES } from './job-types';

export interface JobSender {
  /** Queues a job of type `name` with `data` and resolves to the job's id. */
  send(name: string, data: Record<string, unknown>): Promise<string>;
}

/** Returns a JobSender over a started pg-boss instance. Throws (on send) for a job type not in JOB_TYPES. */
export function pgBossJobSender(boss: PgBoss): JobSender {
  const created = new Map<string, Promise<void>>();
  return {
    async send(name, data) {
      const type = JOB_TYPES.find((t) => t.name === name);
      if (!type) throw new Error(`there is no job type "${name}" (server/jobs/job-types.ts)`);
      let ready = created.get(name);
      if (!ready) {
        ready = boss.createQueue(name, { name, ...type.queue });
        created.set(name, ready);
        ready.catch(() => created.delete(name));
      }
      await ready;
      const id = await boss.send(name, data);
      if (!id) throw new Error(`the job queue did not accept a "${name}" job`);
      return id;
    },
  };
}

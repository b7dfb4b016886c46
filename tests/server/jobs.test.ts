import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rateLimitHits } from '../../db/schema';
import { JOB_TYPES } from '../../server/jobs/job-types';
import { registerWorkers } from '../../server/jobs/register-workers';
import { QUEUE_SCHEMA, startQueue, stopQueue } from '../../server/jobs/queue';
import { createLogger } from '../../server/logger';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { makeTestApp, TEST_DATABASE_URL, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(async () => {
  await ctx.close();
});

describe('job queue', () => {
  it('starts pg-boss in its own schema, runs a sent job on a worker, and stops gracefully', async () => {
    const logger = createLogger('silent', 'test');
    const boss = await startQueue(TEST_DATABASE_URL, logger, { supervise: false, schedule: false });
    try {
      const schemas = await ctx.pool.query('SELECT 1 FROM information_schema.schemata WHERE schema_name = $1', [QUEUE_SCHEMA]);
      expect(schemas.rowCount).toBe(1);

      const tag = `job-${Date.now()}-${Math.random().toString(36).slice(2)}`;
      const expired = [`${tag}-old-1`, `${tag}-old-2`];
      const live = `${tag}-live`;
      await ctx.db.insert(rateLimitHits).values([
        ...expired.map((key) => ({ key, hits: 4, resetAt: new Date(Date.now() - 60_000) })),
        { key: live, hits: 2, resetAt: new Date(Date.now() + 600_000) },
      ]);

      await registerWorkers(boss, { db: ctx.db, files: localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-jobs-'))) }, logger, {
        schedule: false,
        pollingIntervalSeconds: 0.5,
        // Only the job under test: a print-set worker here would take other test files' print-set jobs.
        jobTypes: JOB_TYPES.filter((t) => t.name === 'rate-limit-prune'),
      });
      const jobId = await boss.send('rate-limit-prune', {});
      expect(jobId).toBeTruthy();

      let state = '';
      for (let i = 0; i < 40 && state !== 'completed' && state !== 'failed'; i++) {
        await new Promise((r) => setTimeout(r, 250));
        state = (await boss.getJobById('rate-limit-prune', jobId!))?.state ?? '';
      }
      expect(state).toBe('completed');
      const left = await ctx.db.select({ key: rateLimitHits.key }).from(rateLimitHits).where(inArray(rateLimitHits.key, [...expired, live]));
      expect(left.map((r) => r.key)).toEqual([live]);
    } finally {
      await stopQueue(boss, 5_000);
    }
  });

  it('gives every job type a unique queue name and a valid five-field cron when it repeats', () => {
    const names = JOB_TYPES.map((t) => t.name);
    expect(new Set(names).size).toBe(names.length);
    for (const t of JOB_TYPES) {
      expect(t.name).toMatch(/^[a-z][a-z0-9-]*$/);
      // POSIX crontab: minute hour day-of-month month day-of-week.
      if (t.cron) expect(t.cron.split(' ')).toHaveLength(5);
    }
  });
});

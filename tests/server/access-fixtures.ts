/**
 * The world the access walk (tests/server/access.test.ts) runs in: the app with every dependency a route needs
 * to succeed (a real pg-boss queue without workers, a mail catcher on loopback for invitation, reset, receipt and
 * pack mails and the admin mail view, a temporary file store, job retry), the usual shop fixture, a client the
 * owner granted print sets, and a build whose pattern of a cube is finished, with a sheet plan. The makers below
 * give fresh state to calls that consume it (a member to remove, an invitation to accept, a reset link to use,
 * a failed job to retry).
 */
import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type PgBoss from 'pg-boss';
import request from 'supertest';
import { memberships, shops } from '../../db/schema-core';
import { invitations, passwordResets } from '../../db/schema-sharing';
import { sculpts, seamSets, type SeamLine } from '../../db/schema-sculpts';
import type { Role } from '../../db/validation';
import { encodeWorkingMesh } from '../../geometry/io/working-mesh';
import { platonicSolid } from '../../geometry/shapes';
import { createApp } from '../../server/app';
import { startMailCatcher, type MailCatcher } from '../../server/dev/mail-catcher';
import { parseEnv } from '../../server/env';
import { pgBossJobAdmin } from '../../server/jobs/job-admin';
import { pgBossJobSender, type JobSender } from '../../server/jobs/job-sender';
import { startQueue, stopQueue } from '../../server/jobs/queue';
import { createLogger } from '../../server/logger';
import { hashLinkToken, newLinkToken } from '../../server/mail/link-token';
import { createMailer, type Mailer } from '../../server/mail/send-mail';
import { runPatternJob } from '../../server/patterns/pattern-job';
import { queuePattern } from '../../server/patterns/queue-pattern';
import { sculptMeshKey, sculptSourceKey } from '../../server/sculpts/sculpt-files';
import type { FileStore } from '../../server/storage/file-store';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { insertBuild, insertPerson, makeShopFixture, makeTestApp, sessionCookie, TEST_DATABASE_URL, type ShopFixture, type TestContext } from './helpers';

export interface WalkWorld {
  ctx: TestContext;
  /** The app every walk call goes to (the catcher's mailer, the queue, job retry, the file store). */
  app: Express;
  fx: ShopFixture;
  files: FileStore;
  boss: PgBoss;
  /** A viewer of the fixture shop whom the owner granted print sets (memberships.canSeePrintSets). */
  grantedViewer: { id: string; email: string; cookie: string };
  /** A build of the fixture shop with a finished pattern of a cube (one piece "A", six copies) and a sheet plan. */
  done: { buildId: string; patternId: string; label: string; planId: string };
  close(): Promise<void>;
}

const logger = createLogger('silent', 'test');

/** Returns the 12 edges of platonicSolid('cube', edge) as two-vertex seam paths (every edge of a cube is a crease). */
function cubeEdges(positions: Float64Array, edgeMm: number): number[][] {
  const out: number[][] = [];
  const n = positions.length / 3;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const d = Math.hypot(positions[3 * j] - positions[3 * i], positions[3 * j + 1] - positions[3 * i + 1], positions[3 * j + 2] - positions[3 * i + 2]);
      if (Math.abs(d - edgeMm) < 1e-6) out.push([i, j]);
    }
  }
  return out;
}

/**
 * Inserts a build of `shopId` with a processed cube sculpt whose 12 edges are seams, makes its pattern with the
 * worker's own job function, and returns the ids. The cube unfolds into six congruent squares: one piece "A".
 */
export async function insertPatternBuild(w: Pick<WalkWorld, 'ctx' | 'files'>, shopId: string, name: string): Promise<{ buildId: string; patternId: string }> {
  const cube = platonicSolid('cube', 100);
  const buildId = await insertBuild(w.ctx.db, shopId, name);
  const sculptId = randomUUID();
  await w.files.put(sculptMeshKey(sculptId), encodeWorkingMesh(cube.positions, cube.triangles));
  await w.ctx.db.insert(sculpts).values({
    id: sculptId,
    shopId,
    buildId,
    version: 1,
    fileName: 'crate.obj',
    format: 'obj',
    sourceKey: sculptSourceKey(sculptId, 'obj'),
    sourceBytes: 1,
    units: 'mm',
    targetTriangles: 100_000,
    status: 'done',
    meshKey: sculptMeshKey(sculptId),
  });
  const seams: SeamLine[] = cubeEdges(cube.positions, 100).map((p, i) => ({ id: `e${i}`, picks: [p[0], p[1]], path: p, source: 'picked' }));
  await w.ctx.db.insert(seamSets).values({ sculptId, shopId, revision: 1, seams });
  const queued: Array<Record<string, unknown>> = [];
  const recorder: JobSender = { send: async (_name, data) => (queued.push(data), randomUUID()) };
  const row = await queuePattern(w.ctx.db, recorder, { shopId, buildId, sculptId });
  if (!row || queued.length !== 1) throw new Error(`the walk's cube build ${buildId} did not queue a pattern`);
  const result = await runPatternJob({ db: w.ctx.db, files: w.files }, queued[0]);
  const { rows } = await w.ctx.pool.query('SELECT status, error FROM patterns WHERE id = $1', [row.id]);
  if (rows[0]?.status !== 'done') throw new Error(`the walk's cube pattern ended ${rows[0]?.status} (${rows[0]?.error ?? JSON.stringify(result)})`);
  return { buildId, patternId: row.id };
}

/** Inserts a person who is a `role` member of the fixture shop (for a role change or a removal) and returns the id. */
export async function insertMember(w: WalkWorld, role: Role = 'viewer'): Promise<string> {
  const person = await insertPerson(w.ctx.db, 'walk-member');
  await w.ctx.db.insert(memberships).values({ userId: person.id, shopId: w.fx.shopId, role });
  return person.id;
}

/**
 * Inserts a pending invitation for `email` (a fresh address by default) into `shopId` (a new shop by default, so
 * accepting it changes none of the fixture's memberships) and returns its id and link token.
 */
export async function insertInvitation(w: WalkWorld, options: { shopId?: string; email?: string } = {}): Promise<{ id: string; token: string }> {
  const shopId = options.shopId ?? (await w.ctx.db.insert(shops).values({ name: 'Walk invitation shop' }).returning({ id: shops.id }))[0].id;
  const { token, tokenHash } = newLinkToken();
  const [row] = await w.ctx.db
    .insert(invitations)
    .values({ shopId, email: options.email ?? `walk-invitee-${randomUUID().slice(0, 8)}@test.example.com`, role: 'viewer', tokenHash, invitedBy: w.fx.people.owner.id, expiresAt: new Date(Date.now() + 3_600_000) })
    .returning({ id: invitations.id });
  return { id: row.id, token };
}

/** Inserts a person with an unused one-hour reset link and returns the link token (so a confirm signs no persona out). */
export async function insertResetLink(w: WalkWorld): Promise<string> {
  const person = await insertPerson(w.ctx.db, 'walk-reset');
  const { token } = newLinkToken();
  await w.ctx.db.insert(passwordResets).values({ userId: person.id, tokenHash: hashLinkToken(token), expiresAt: new Date(Date.now() + 3_600_000) });
  return token;
}

/**
 * Returns the id of a job that failed (taken and failed by hand, no worker), ready to be retried. Each job has a
 * queue of its own, so an earlier job put back by a retry is never the one taken here.
 */
export async function insertFailedJob(w: WalkWorld): Promise<string> {
  const queue = `walk-probe-${randomUUID()}`;
  await w.boss.createQueue(queue, { name: queue, retryLimit: 0 });
  const id = await w.boss.send(queue, { walk: true });
  if (!id) throw new Error(`the queue did not accept a ${queue} job`);
  const taken = await w.boss.fetch(queue, { batchSize: 1 });
  if (taken[0]?.id !== id) throw new Error(`the walk's probe job ${id} was not the one taken from ${queue}`);
  await w.boss.fail(queue, id, { message: 'walk probe failed on purpose' });
  return id;
}

/** Starts the queue, the mail catcher and the app, and makes the fixture; `close` stops them in reverse order. */
export async function makeWalkWorld(): Promise<WalkWorld> {
  const boss = await startQueue(TEST_DATABASE_URL, logger, { supervise: false, schedule: false });
  const files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-walk-')));
  const ctx = await makeTestApp({ signInLimit: { max: 1000, windowMs: 60_000 } });
  const catcher: MailCatcher = await startMailCatcher({ smtpPort: 0, httpPort: 0 });
  const mailer: Mailer = createMailer({ SMTP_URL: `smtp://127.0.0.1:${catcher.smtpPort}`, MAIL_FROM: 'Sheetsmith <no-reply@sheetsmith.example.com>' }, ctx.db);
  const app = createApp({
    // PAY_WEBHOOK_SECRET stays at its default: packs-fixtures.ts signs the webhook call with it.
    env: parseEnv({ NODE_ENV: 'test', DATABASE_URL: TEST_DATABASE_URL, WEB_ROOT: '/nonexistent-web-root', MAIL_CATCHER_URL: `http://127.0.0.1:${catcher.httpPort}` }),
    pool: ctx.pool,
    db: ctx.db,
    sessionSecret: ctx.secret,
    logger,
    // Every walk call comes from loopback; the limits have their own tests.
    signInLimit: { max: 100_000, windowMs: 60_000 },
    signUpLimit: null,
    passwordResetLimit: null,
    checkoutLimit: null,
    jobs: pgBossJobSender(boss),
    jobAdmin: pgBossJobAdmin(boss),
    files,
    mailer,
  });
  const fx = await makeShopFixture(ctx);
  const granted = await insertPerson(ctx.db, 'client');
  await ctx.db.insert(memberships).values({ userId: granted.id, shopId: fx.shopId, role: 'viewer', canSeePrintSets: true });
  const partial = { ctx, files };
  const { buildId, patternId } = await insertPatternBuild(partial, fx.shopId, 'Walk crate');
  const plan = await request(app).post(`/api/shops/${fx.shopId}/builds/${buildId}/sheet-plans`).set('Cookie', fx.people.owner.cookie).send({ patternId });
  if (plan.status !== 202) throw new Error(`the walk's sheet plan was refused: ${plan.status} ${JSON.stringify(plan.body)}`);
  return {
    ctx,
    app,
    fx,
    files,
    boss,
    grantedViewer: { ...granted, cookie: await sessionCookie(ctx.key, granted.id) },
    done: { buildId, patternId, label: 'A', planId: plan.body.sheetPlan.id },
    close: async () => {
      mailer.close();
      await catcher.close();
      await stopQueue(boss, 5_000);
      await ctx.close();
    },
  };
}

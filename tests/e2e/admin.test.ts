/**
 * Browser test of the site admin pages against the real server (a child process), the test database, a real
 * pg-boss queue and the local mail catcher (in-process, random ports): a shop owner who is not a site admin is
 * turned away from /admin; a site admin finds a person, a shop, a failed job (retries it from the page, and it
 * runs again) and a caught mail (reads its text and its HTML in a sandboxed frame), at 390 and 1280 px.
 * Screenshots go to tests/artifacts/admin-*.png.
 */
import { randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import nodemailer from 'nodemailer';
import type PgBoss from 'pg-boss';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memberships, shops } from '../../db/schema-core';
import { startMailCatcher, type MailCatcher } from '../../server/dev/mail-catcher';
import { SESSION_COOKIE, sessionKey, signSessionToken } from '../../server/auth/session';
import { startQueue, stopQueue } from '../../server/jobs/queue';
import { createLogger } from '../../server/logger';
import { insertPerson, makeTestApp, type TestContext } from '../server/helpers';
import { appProcesses, artifacts, freePort, haveDist, launchBrowser } from './browser-harness';

const SECRET = 'e2e-admin-session-secret-long-enough-0123456789';
const tag = `e2eadm${randomUUID().slice(0, 6)}`;
const QUEUE = `ops-e2e-probe-${tag}`;

let ctx: TestContext;
const app = appProcesses();
let base = '';
let browser: Browser | null = null;
let catcher: MailCatcher;
let boss: PgBoss;
let adminId = '';
let ownerId = '';
const attempts = new Map<string, number>();

async function cookieFor(userId: string) {
  return { name: SESSION_COOKIE, value: await signSessionToken(sessionKey(SECRET), { userId, generation: 0 }), url: base };
}

describe.skipIf(!haveDist)(haveDist ? 'site admin pages in a browser' : 'site admin pages — SKIPPED: dist/ is missing; run npm run web:build', () => {
  beforeAll(async () => {
    mkdirSync(artifacts, { recursive: true });
    ctx = await makeTestApp();
    adminId = (await insertPerson(ctx.db, `${tag}admin`, true)).id;
    const owner = await insertPerson(ctx.db, `${tag}owner`);
    ownerId = owner.id;
    const [shop] = await ctx.db.insert(shops).values({ name: `Offcut Works ${tag}` }).returning({ id: shops.id });
    await ctx.db.insert(memberships).values({ shopId: shop.id, userId: owner.id, role: 'owner' });
    catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0 });
    const logger = createLogger('silent', 'test');
    boss = await startQueue(ctx.pool.options.connectionString as string, logger, { supervise: false, schedule: false });
    await boss.createQueue(QUEUE, { name: QUEUE, retryLimit: 0 });
    // The first run of each job fails; a retried run succeeds (what an admin's Retry is for).
    await boss.work(QUEUE, { pollingIntervalSeconds: 0.5 }, async ([job]) => {
      const n = (attempts.get(job.id) ?? 0) + 1;
      attempts.set(job.id, n);
      if (n === 1) throw new Error(`stock sheet list for ${tag} could not be read`);
      return { ok: true };
    });

    const port = await freePort();
    base = `http://127.0.0.1:${port}`;
    app.start('server', 'server/index.ts', { ...process.env, PORT: String(port), WEB_ROOT: 'dist', SESSION_SECRET: SECRET, MAIL_CATCHER_URL: `http://127.0.0.1:${catcher.httpPort}`, LOG_LEVEL: 'warn' });
    await app.waitForHealth(`${base}/api/health`, 60_000);
    browser = await launchBrowser();
  }, 90_000);

  afterAll(async () => {
    await browser?.close();
    await app.stop();
    await boss?.offWork(QUEUE).catch(() => undefined);
    await stopQueue(boss, 5_000).catch(() => undefined);
    await catcher?.close();
    await ctx?.close();
  });

  for (const vp of [
    { width: 390, height: 844, wide: false },
    { width: 1280, height: 800, wide: true },
  ]) {
    it(`turns away a non-admin and lets a site admin see people, shops, failed jobs (retry) and caught mail — ${vp.width} px`, async () => {
      const jobId = (await boss.send(QUEUE, { width: vp.width }))!;
      const subject = `Invitation to Offcut Works ${tag} ${vp.width}`;
      await nodemailer
        .createTransport({ host: '127.0.0.1', port: catcher.smtpPort, secure: false, ignoreTLS: true })
        .sendMail({ from: 'no-reply@sheetsmith.example.com', to: `crew-${vp.width}-${tag}@test.example.com`, subject, text: `Join the shop ${vp.width}`, html: `<h1>Join the shop ${vp.width}</h1>` });

      const context = await browser!.newContext({ viewport: { width: vp.width, height: vp.height } });
      const page = await context.newPage();
      const errors: string[] = [];
      page.on('pageerror', (e) => errors.push(e.message));
      const shot = (name: string) => page.screenshot({ path: path.join(artifacts, `admin-${vp.width}-${name}.png`), fullPage: true });
      try {
        // A shop owner who is not a site admin is sent away from /admin (to the signed-in home).
        await context.addCookies([await cookieFor(ownerId)]);
        await page.goto(`${base}/admin/users`);
        await page.waitForURL((u) => !u.pathname.startsWith('/admin'), { timeout: 30_000 });
        expect(new URL(page.url()).pathname).not.toMatch(/^\/admin/);

        await context.clearCookies();
        await context.addCookies([await cookieFor(adminId)]);
        await page.goto(`${base}/admin`);
        await page.getByRole('heading', { name: 'People', level: 1 }).waitFor();
        await page.getByLabel('Search people').fill(tag);
        const people = page.getByRole(vp.wide ? 'table' : 'list', { name: 'People' });
        await people.getByText(`${tag}owner`, { exact: false }).first().waitFor();
        await expect(people.getByText(`${tag}admin`, { exact: false }).count()).resolves.toBeGreaterThan(0);
        await shot('1-people');

        await page.getByRole('link', { name: 'Admin: Shops' }).click();
        await page.getByRole('heading', { name: 'Shops', level: 1 }).waitFor();
        await page.getByLabel('Search shops').fill(tag);
        await page.getByRole(vp.wide ? 'table' : 'list', { name: 'Shops' }).getByText(`Offcut Works ${tag}`).waitFor();

        await page.getByRole('link', { name: 'Admin: Jobs' }).click();
        await page.getByRole('heading', { name: 'Jobs', level: 1 }).waitFor();
        // The failed job shows with the error it ended with; Retry puts it back and it runs again.
        await page.getByText(`stock sheet list for ${tag} could not be read`).first().waitFor({ timeout: 30_000 });
        await shot('2-failed-job');
        await page.getByRole('button', { name: `Retry job ${QUEUE} ${jobId.slice(0, 8)}` }).click();
        for (let i = 0; i < 80 && attempts.get(jobId) !== 2; i++) await new Promise((r) => setTimeout(r, 250));
        expect(attempts.get(jobId)).toBe(2);
        await page.getByRole('button', { name: `Retry job ${QUEUE} ${jobId.slice(0, 8)}` }).waitFor({ state: 'detached', timeout: 15_000 });

        await page.getByRole('link', { name: 'Admin: Mail' }).click();
        await page.getByRole('heading', { name: 'Mail', level: 1 }).waitFor();
        await page.getByRole('button', { name: `Read ${subject}` }).click();
        await page.getByRole('heading', { name: subject, level: 2 }).waitFor();
        await page.getByText(`Join the shop ${vp.width}`).first().waitFor();
        await page.getByRole('button', { name: 'Show the HTML part' }).click();
        const frame = page.frameLocator(`iframe[title="HTML of ${subject}"]`);
        await frame.getByRole('heading', { name: `Join the shop ${vp.width}` }).waitFor();
        await shot('3-mail');
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    }, 120_000);
  }
});

/**
 * Browser test of crew and clients against the real server, database and an in-process mail catcher: an owner
 * invites a client by e-mail from the members page; the mail is caught; the invite link, opened in a fresh
 * browser context, offers sign-up with the invited address; the new client lands in the shop at viewer role and
 * sees the build without edit controls and without print sets (403 until the owner grants them); then the
 * forgotten-password flow by mail. Phone (390 × 844) and laptop (1280 × 800) windows; screenshots go to
 * tests/artifacts/crew-*.png.
 *
 * Expected texts come from this issue's API contract (CONTRACTS.md: routes, roles) and the request schemas in
 * db/validation.ts and db/validation-crew.ts (field messages).
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailCatcher, type CaughtMail, type MailCatcher } from '../../server/dev/mail-catcher';
import { appProcesses, artifacts, freePort, haveDist, launchBrowser } from './browser-harness';

const app = appProcesses();
let base = '';
let browser: Browser | null = null;
let catcher: MailCatcher | null = null;

async function mailTo(to: string, subject: RegExp): Promise<CaughtMail> {
  const until = Date.now() + 15_000;
  while (Date.now() < until) {
    const found = catcher!.messages().find((m) => m.to.includes(to) && subject.test(m.subject));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} with subject ${subject} within 15 s; caught: ${catcher!.messages().map((m) => `${m.to} ${m.subject}`).join('; ')}`);
}

describe.skipIf(!haveDist)(haveDist ? 'crew and clients in a browser' : 'crew and clients in a browser — SKIPPED: dist/ is missing; run `npm run web:build`', () => {
  beforeAll(async () => {
    const databaseUrl = process.env.DATABASE_URL;
    if (!databaseUrl) throw new Error('DATABASE_URL is not set: run the browser test against a test database.');
    mkdirSync(artifacts, { recursive: true });
    catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0 });
    const port = await freePort();
    base = `http://127.0.0.1:${port}`;
    app.start('server', 'server/index.ts', {
      ...process.env,
      PORT: String(port),
      WEB_ROOT: 'dist',
      SESSION_SECRET: 'e2e-crew-session-secret-that-is-long-enough-0123',
      DATABASE_URL: databaseUrl,
      SMTP_URL: `smtp://127.0.0.1:${catcher.smtpPort}`,
      PUBLIC_URL: base,
      SIGNUP_RATE_LIMIT: '1000',
      PASSWORD_RESET_RATE_LIMIT_IP: '1000',
    });
    await app.waitForHealth(`${base}/api/health`, 60_000);
    browser = await launchBrowser();
  }, 90_000);

  afterAll(async () => {
    await browser?.close();
    await app.stop();
    await catcher?.close();
  });

  for (const vp of [
    { width: 390, height: 844 },
    { width: 1280, height: 800 },
  ]) {
    it(`owner invites a client by e-mail; the client signs up from the link and follows the build as a viewer — ${vp.width} px`, { timeout: 240_000 }, async () => {
      const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
      const ownerEmail = `owner-${vp.width}-${stamp}@example.com`;
      const clientEmail = `client-${vp.width}-${stamp}@example.com`;
      const pageErrors: string[] = [];
      const contexts: BrowserContext[] = [];
      const newContext = async () => {
        const c = await browser!.newContext({ viewport: { width: vp.width, height: vp.height } });
        // The machine is shared with other builds and tests; a first page load can take well over the 30 s default.
        c.setDefaultTimeout(60_000);
        contexts.push(c);
        return c;
      };
      try {
        // The owner and a build, made through the API in the owner's browser context (the shell test covers that UI).
        const ownerContext = await newContext();
        const owner = await ownerContext.newPage();
        owner.on('pageerror', (e) => pageErrors.push(e.message));
        const shot = (page: typeof owner, name: string) => page.screenshot({ path: path.join(artifacts, `crew-${vp.width}-${name}.png`), fullPage: true });
        const signup = await ownerContext.request.post(`${base}/api/auth/signup`, { data: { name: 'Shop Owner', email: ownerEmail, password: 'owner-bench-pass-1' } });
        expect(signup.status()).toBe(201);
        const shopId: string = (await signup.json()).memberships[0].shopId;
        const build = await ownerContext.request.post(`${base}/api/shops/${shopId}/builds`, { data: { name: 'Commission helmet' } });
        expect(build.status()).toBe(201);
        const buildId: string = (await build.json()).build.id;

        await owner.goto(`${base}/members`);
        await owner.getByRole('heading', { name: 'Crew and clients', level: 2 }).waitFor();
        await owner.getByRole('list', { name: 'Members' }).getByText('Shop Owner (you)').waitFor();
        // The invite form checks with the server's schema before sending.
        await owner.getByLabel('E-mail to invite').fill('not an address');
        await owner.getByRole('button', { name: 'Send invitation' }).click();
        await owner.getByText('Enter an e-mail address like name@example.com').waitFor();
        await owner.getByLabel('E-mail to invite').fill(clientEmail);
        const inviteRole = owner.getByRole('radiogroup', { name: 'Role to invite as' });
        await inviteRole.getByRole('radio', { name: /^Client/ }).click();
        await expect(inviteRole.getByRole('radio', { name: /^Client/ }).getAttribute('aria-checked')).resolves.toBe('true');
        await owner.getByRole('button', { name: 'Send invitation' }).click();
        await owner.getByText(`Invitation sent to ${clientEmail}. The link works for 7 days.`).waitFor();
        await owner.getByRole('listitem', { name: `Invitation to ${clientEmail}` }).waitFor();
        await shot(owner, '1-owner-invited');

        // The mail: both parts, the link on this server.
        const mail = await mailTo(clientEmail, /invites you to/);
        expect(mail.html).toContain('Accept the invitation');
        const link = /(http:\/\/127\.0\.0\.1:\d+\/invite\/[A-Za-z0-9_-]{43})/.exec(mail.text)?.[1];
        expect(link, mail.text).toBeTruthy();

        // Opened by someone signed in with another address, the page says so and offers to sign out (no accept).
        await owner.goto(link!);
        await owner.getByText(`You are signed in as ${ownerEmail}, but this invitation is for ${clientEmail}.`, { exact: false }).waitFor();
        await expect(owner.getByRole('button', { name: 'Sign out' }).count()).resolves.toBeGreaterThan(0);
        await expect(owner.getByRole('button', { name: /accept/i }).count()).resolves.toBe(0);

        // The client opens the link in a fresh browser (no session): sign-up is offered with the address filled in.
        const clientContext = await newContext();
        const client = await clientContext.newPage();
        client.on('pageerror', (e) => pageErrors.push(e.message));
        await client.goto(link!);
        await client.getByRole('heading', { name: /^Join .*shop$/, level: 1 }).waitFor();
        await client.getByText(`invites ${clientEmail} as client`).waitFor();
        await expect(client.getByLabel('E-mail').inputValue()).resolves.toBe(clientEmail);
        await shot(client, '2-invite-page');
        await client.getByLabel('Your name').fill('Commission Client');
        await client.getByLabel('Password').fill('client-bench-pass-2');
        await client.getByRole('button', { name: 'Create account and accept' }).click();

        // Accepted: the builds list of the owner's shop, as a client.
        await client.getByRole('heading', { name: 'Builds', level: 1 }).waitFor();
        await client.getByRole('link', { name: 'Commission helmet', exact: true }).first().waitFor();
        const nav = client.getByRole('navigation', { name: 'Main' });
        await nav.getByLabel('Role: Client').first().waitFor();
        await shot(client, '3-client-builds');
        await client.getByRole('link', { name: 'Commission helmet', exact: true }).first().click();
        await client.getByRole('heading', { name: 'Commission helmet', level: 1 }).waitFor();
        // A client looks but does not change: no rename, no delete.
        await expect(client.getByRole('button', { name: /^Rename/ }).count()).resolves.toBe(0);
        await expect(client.getByRole('button', { name: /^Delete/ }).count()).resolves.toBe(0);
        // The build page says print sets are not shared (the build page's own wording, H-builds).
        await client.getByText(/has not opened print sets to you/).waitFor();
        await shot(client, '4-client-build');
        // Print sets stay closed to the client until the owner allows them.
        const closed = await clientContext.request.get(`${base}/api/shops/${shopId}/builds/${buildId}/print-sets`);
        expect(closed.status()).toBe(403);
        const me = await (await clientContext.request.get(`${base}/api/me`)).json();
        expect(me.memberships.find((m: { shopId: string }) => m.shopId === shopId)).toMatchObject({ role: 'viewer', canSeePrintSets: false });

        // The owner sees the client in the list and lets them see print sets.
        await owner.goto(`${base}/members`);
        const clientRow = owner.getByRole('listitem', { name: 'Commission Client, viewer' });
        await clientRow.waitFor();
        await expect(owner.getByRole('listitem', { name: `Invitation to ${clientEmail}` }).count()).resolves.toBe(0);
        await owner.getByRole('switch', { name: 'Print sets for Commission Client' }).click();
        await clientRow.getByText('Sees print sets').waitFor();
        await shot(owner, '5-owner-granted');
        const open = await clientContext.request.get(`${base}/api/shops/${shopId}/builds/${buildId}/print-sets`);
        expect(open.status()).toBe(200);

        // Forgotten password: from sign-in, by mail, to a new password.
        const resetContext = await newContext();
        const reset = await resetContext.newPage();
        reset.on('pageerror', (e) => pageErrors.push(e.message));
        await reset.goto(`${base}/sign-in`);
        await reset.getByRole('link', { name: 'Forgot your password?' }).click();
        await reset.getByRole('heading', { name: 'Forgot your password?', level: 1 }).waitFor();
        await reset.getByLabel('E-mail').fill(clientEmail);
        await reset.getByRole('button', { name: 'Send reset link' }).click();
        await reset.getByText('If an account uses this e-mail address, a link to set a new password is on its way.', { exact: false }).waitFor();
        const resetMail = await mailTo(clientEmail, /password reset/);
        const resetLink = /(http:\/\/127\.0\.0\.1:\d+\/reset-password\?token=[A-Za-z0-9_-]{43})/.exec(resetMail.text)?.[1];
        expect(resetLink, resetMail.text).toBeTruthy();
        await reset.goto(resetLink!);
        await reset.getByLabel('New password', { exact: true }).fill('client-new-pass-33');
        await reset.getByLabel('New password again').fill('client-new-pass-3');
        await reset.getByRole('button', { name: 'Set new password' }).click();
        await reset.getByText('The two passwords differ').waitFor();
        await reset.getByLabel('New password again').fill('client-new-pass-33');
        await reset.getByRole('button', { name: 'Set new password' }).click();
        await reset.getByText(`The password of ${clientEmail} is set.`, { exact: false }).waitFor();
        await shot(reset, '6-password-set');
        // The client's earlier session ended with the reset.
        expect((await clientContext.request.get(`${base}/api/me`)).status()).toBe(401);
        await reset.getByRole('link', { name: 'Go to sign in' }).click();
        await reset.getByLabel('E-mail').fill(clientEmail);
        await reset.getByLabel('Password').fill('client-new-pass-33');
        await reset.getByRole('button', { name: 'Sign in', exact: true }).click();
        await reset.getByRole('heading', { name: 'Builds', level: 1 }).waitFor();

        expect(pageErrors).toEqual([]);
      } catch (err) {
        // Keep what each window showed when it went wrong, for the person reading the failure.
        let n = 0;
        for (const c of contexts) for (const p of c.pages()) await p.screenshot({ path: path.join(artifacts, `crew-${vp.width}-failure-${++n}.png`) }).catch(() => undefined);
        throw err;
      } finally {
        for (const c of contexts) await c.close();
      }
    });
  }
});

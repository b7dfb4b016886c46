/**
 * Browser test of the app shell against the real server and database: sign up, start a build, see it, rename
 * it, sign out, sign back in, delete it — on a phone-sized and a laptop-sized window. Screenshots go to
 * tests/artifacts/ (ignored by git) for a person to look at.
 *
 * Expected texts come from the API contract of issue 2 (routes, roles, error codes), the request schemas in
 * db/validation.ts (field messages) and the window widths in the H2 brief (390 × 844 and 1280 × 800; the side
 * bar appears from 1024 px).
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appProcesses, artifacts, freePort, haveDist, launchBrowser } from './browser-harness';

const app = appProcesses();
let base = '';
let browser: Browser | null = null;

describe.skipIf(!haveDist)(
  haveDist ? 'app shell in a browser' : 'app shell in a browser — SKIPPED: dist/ is missing; run `npm run web:build` (npm test does it)',
  () => {
    beforeAll(async () => {
      const databaseUrl = process.env.DATABASE_URL;
      if (!databaseUrl) throw new Error('DATABASE_URL is not set: run the browser test through `npm test`, which starts the test database.');
      mkdirSync(artifacts, { recursive: true });
      const port = await freePort();
      base = `http://127.0.0.1:${port}`;
      app.start('server', 'server/index.ts', {
        ...process.env,
        PORT: String(port),
        WEB_ROOT: 'dist',
        SESSION_SECRET: 'e2e-session-secret-that-is-long-enough-0123456789',
        DATABASE_URL: databaseUrl,
        // Every browser test signs up from loopback; the sign-up limit (10 an hour) is the API tests' business.
        SIGNUP_RATE_LIMIT: '1000',
      });
      await app.waitForHealth(`${base}/api/health`, 60_000);
      browser = await launchBrowser();
    });

    afterAll(async () => {
      await browser?.close();
      await app.stop();
    });

    const viewports = [
      { width: 390, height: 844, wide: false },
      { width: 1280, height: 800, wide: true },
    ];

    for (const vp of viewports) {
      it(`signs up, starts, renames and deletes a build, signs out and in — ${vp.width} px`, async () => {
        const context = await browser!.newContext({ viewport: { width: vp.width, height: vp.height } });
        const page = await context.newPage();
        const pageErrors: string[] = [];
        page.on('pageerror', (e) => pageErrors.push(e.message));
        const shot = (name: string) => page.screenshot({ path: path.join(artifacts, `shell-${vp.width}-${name}.png`) });
        const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
        const email = `maker-${vp.width}-${stamp}@example.com`;
        const password = 'offcut-bevel-30deg';
        const name = `Bench Tester ${vp.width}`;

        try {
          // An anonymous visitor to the site root is sent to sign in (the signed-in group's guard).
          await page.goto(base + '/');
          await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();
          expect(new URL(page.url()).pathname).toBe('/sign-in');
          await shot('1-sign-in');

          await page.getByRole('link', { name: 'Create an account' }).click();
          await page.getByRole('heading', { name: 'Create your account' }).waitFor();

          // Empty form: the client checks with the server's schema (db/validation.ts messages).
          await page.getByRole('button', { name: 'Create account' }).click();
          await page.getByText('Enter your name').waitFor();
          await page.getByText('Use at least 10 characters').waitFor();
          await shot('2-sign-up-errors');

          await page.getByLabel('Your name').fill(name);
          await page.getByLabel('E-mail').fill(email);
          await page.getByLabel('Password').fill(password);
          await page.getByRole('button', { name: 'Create account' }).click();

          // Signing up makes the person owner of a new shop of their own (issue 2 API contract).
          await page.getByRole('heading', { name: 'Builds', level: 1 }).waitFor();
          expect(new URL(page.url()).pathname).toBe('/builds');
          const nav = page.getByRole('navigation', { name: 'Main' });
          await expect(nav.getByText(name).first().isVisible()).resolves.toBe(true);
          await expect(nav.getByLabel('Role: Owner').first().isVisible()).resolves.toBe(true);
          await expect(nav.getByRole('button', { name: 'Sign out' }).isVisible()).resolves.toBe(true);
          // The main sections (components/nav/app-frame.tsx): builds, crew & clients, pattern packs; the site
          // admin link only for site admins, which a new account is not.
          for (const section of ['Builds', 'Crew & clients', 'Pattern packs']) {
            await expect(nav.getByRole('link', { name: section, exact: true }).isVisible()).resolves.toBe(true);
          }
          await expect(nav.getByRole('link', { name: 'Site admin' }).count()).resolves.toBe(0);
          await expect(nav.getByRole('link', { name: 'Builds', exact: true }).getAttribute('aria-current')).resolves.toBe('page');
          // The side bar sits left of the page from 1024 px; on a phone the bar spans the top.
          const navBox = (await nav.boundingBox())!;
          if (vp.wide) {
            expect(navBox.x).toBe(0);
            expect(navBox.height).toBeGreaterThanOrEqual(vp.height - 1);
            expect(navBox.width).toBeLessThan(vp.width / 2);
          } else {
            expect(navBox.y).toBe(0);
            expect(navBox.width).toBeGreaterThanOrEqual(vp.width - 1);
          }
          await page.getByText('No builds yet').waitFor();

          await page.getByLabel('Build name').fill('Ridge helmet');
          await page.getByRole('button', { name: 'Start build' }).click();
          const list = page.getByRole(vp.wide ? 'table' : 'list', { name: 'Builds' });
          await list.getByRole('link', { name: 'Ridge helmet', exact: true }).waitFor();
          await page.getByLabel('Build name').fill('Left pauldron');
          await page.getByRole('button', { name: 'Start build' }).click();
          await list.getByRole('link', { name: 'Left pauldron', exact: true }).waitFor();
          // Newest first.
          await expect(list.getByRole('link').allTextContents()).resolves.toEqual(['Left pauldron', 'Ridge helmet']);
          await shot('3-builds');

          await page.getByRole('button', { name: 'Rename Ridge helmet', exact: true }).click();
          const renameField = page.getByLabel('New name for “Ridge helmet”');
          await renameField.fill('   ');
          await page.getByRole('button', { name: 'Save name' }).click();
          await page.getByText('Give the build a name').waitFor();
          await renameField.fill('Ridge helmet, second fit');
          await page.getByRole('button', { name: 'Save name' }).click();
          await list.getByRole('link', { name: 'Ridge helmet, second fit', exact: true }).waitFor();
          await expect(list.getByRole('link', { name: 'Ridge helmet', exact: true }).count()).resolves.toBe(0);
          await shot('4-renamed');

          await list.getByRole('link', { name: 'Ridge helmet, second fit', exact: true }).click();
          await page.getByRole('heading', { name: 'Ridge helmet, second fit', level: 1 }).waitFor();
          await page.getByRole('heading', { name: 'From sculpt to foam' }).waitFor();
          await page.getByText('safety data sheet').waitFor();
          await shot('5-build-page');

          await nav.getByRole('button', { name: 'Sign out' }).click();
          await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();
          // Signed out for real: the signed-in area sends the visitor back to sign in.
          await page.goto(base + '/builds');
          await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();
          expect(new URL(page.url()).pathname).toBe('/sign-in');

          // The same e-mail cannot sign up twice: 409 EMAIL_TAKEN lands under the e-mail field.
          await page.getByRole('link', { name: 'Create an account' }).click();
          await page.getByLabel('Your name').fill('Someone Else');
          await page.getByLabel('E-mail').fill(email);
          await page.getByLabel('Password').fill('another-long-password');
          await page.getByRole('button', { name: 'Create account' }).click();
          await expect.poll(() => page.getByLabel('E-mail').getAttribute('aria-invalid'), { timeout: 10_000 }).toBe('true');
          await page.getByRole('link', { name: 'Sign in' }).click();
          await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();

          // A wrong password shows the server's message (401 BAD_CREDENTIALS) and stays on sign in.
          await page.getByLabel('E-mail').fill(email);
          await page.getByLabel('Password').fill('not-the-password');
          await page.getByRole('button', { name: 'Sign in' }).click();
          const alert = page.getByRole('alert');
          await alert.first().waitFor();
          expect((await alert.first().textContent())?.trim().length).toBeGreaterThan(0);
          await shot('6-bad-credentials');

          await page.getByLabel('Password').fill(password);
          await page.getByRole('button', { name: 'Sign in' }).click();
          await page.getByRole('heading', { name: 'Builds', level: 1 }).waitFor();
          await list.getByRole('link', { name: 'Ridge helmet, second fit', exact: true }).waitFor();

          // Delete asks first; "Keep it" keeps the build, "Delete build" removes it.
          await page.getByRole('button', { name: 'Delete Left pauldron', exact: true }).click();
          await page.getByRole('button', { name: 'Keep it' }).click();
          await list.getByRole('link', { name: 'Left pauldron', exact: true }).waitFor();
          await page.getByRole('button', { name: 'Delete Left pauldron', exact: true }).click();
          await shot('7-delete-confirm');
          await page.getByRole('button', { name: 'Delete build Left pauldron for good' }).click();
          await list.getByRole('link', { name: 'Left pauldron', exact: true }).waitFor({ state: 'detached' });
          await expect(list.getByRole('link').allTextContents()).resolves.toEqual(['Ridge helmet, second fit']);

          await nav.getByRole('button', { name: 'Sign out' }).click();
          await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();
          expect(pageErrors).toEqual([]);
        } catch (e) {
          await shot('failure').catch(() => undefined);
          throw e;
        } finally {
          await context.close();
        }
      }, 120_000);
    }
  },
);

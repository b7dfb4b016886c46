/**
 * Browser test of buying a pattern pack as a visitor (no sign-in), against the real server, database, local
 * payment fake and mail catcher: catalogue → pack page → e-mail → the fake's pay page → back to the pack page
 * ("check your e-mail") → the receipt arrives in the catcher → its link opens the download page → the PDF
 * downloads and reads as a PDF. On a phone-sized and a laptop-sized window; screenshots go to tests/artifacts/.
 */
import { mkdirSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, createPool } from '../../db/client';
import { builds, memberships, shops, users } from '../../db/schema-core';
import { DEMO_PACKS, seedDemoPacks } from '../../db/seed-packs';
import { startMailCatcher, type MailCatcher } from '../../server/dev/mail-catcher';
import { startPaymentFake, type PaymentFake } from '../../server/dev/payment-fake';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { appProcesses, artifacts, freePort, haveDist, launchBrowser } from './browser-harness';

const API_KEY = 'e2e-pay-key-0123456789';
const SECRET = 'e2e-webhook-secret-0123456789';

const app = appProcesses();
let base = '';
let browser: Browser | null = null;
let fake: PaymentFake;
let catcher: MailCatcher;
const tag = Math.random().toString(36).slice(2, 8);
const paidDemo = { ...DEMO_PACKS[0], slug: `${DEMO_PACKS[0].slug}-${tag}`, title: `${DEMO_PACKS[0].title} ${tag}` };

describe.skipIf(!haveDist)(haveDist ? 'buying a pattern pack in a browser' : 'buying a pattern pack — SKIPPED: dist/ is missing; run `npm run web:build`', () => {
  beforeAll(async () => {
    const databaseUrl = process.env.DATABASE_URL;
    if (!databaseUrl) throw new Error('DATABASE_URL is not set: run the browser test through `npm test`, which starts the test database.');
    mkdirSync(artifacts, { recursive: true });
    const filesDir = mkdtempSync(path.join(tmpdir(), 'sheetsmith-e2e-packs-'));
    const port = await freePort();
    base = `http://127.0.0.1:${port}`;
    fake = await startPaymentFake({ port: 0, webhookUrl: `${base}/api/pay/webhook`, webhookSecret: SECRET, apiKey: API_KEY });
    catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0 });

    // The demo pack, seeded as npm start seeds it, into a shop of its own (the server runs migrations first).
    const pool = createPool(databaseUrl, 2);
    try {
      const db = createDb(pool);
      const { runMigrations } = await import('../../db/migrate');
      await runMigrations(pool);
      const [owner] = await db.insert(users).values({ email: `e2e-owner-${tag}@test.example.com`, name: 'E2E owner', passwordHash: 'not-used' }).returning({ id: users.id });
      const [shop] = await db.insert(shops).values({ name: 'Lanternworks Foam' }).returning({ id: shops.id });
      await db.insert(memberships).values({ userId: owner.id, shopId: shop.id, role: 'owner' });
      const [build] = await db.insert(builds).values({ shopId: shop.id, name: 'Beetle knight helmet' }).returning({ id: builds.id });
      await db.transaction((tx) => seedDemoPacks(tx, localDiskStore(filesDir), { shopId: shop.id, buildId: build.id, ownerId: owner.id }, { demos: [paidDemo] }));
    } finally {
      await pool.end();
    }

    app.start('server', 'server/index.ts', {
      ...process.env,
      PORT: String(port),
      WEB_ROOT: 'dist',
      STORAGE: 'disk',
      FILES_DIR: filesDir,
      SESSION_SECRET: 'e2e-session-secret-that-is-long-enough-0123456789',
      DATABASE_URL: databaseUrl,
      PUBLIC_URL: base,
      SMTP_URL: `smtp://127.0.0.1:${catcher.smtpPort}`,
      PAY_API_URL: fake.url,
      PAY_API_KEY: API_KEY,
      PAY_WEBHOOK_SECRET: SECRET,
      // Each run checks out twice from loopback; repeated runs within the window must not hit the limit.
      CHECKOUT_RATE_LIMIT: '10000',
    });
    await app.waitForHealth(`${base}/api/health`, 60_000);
    browser = await launchBrowser();
  });

  afterAll(async () => {
    await browser?.close();
    await app.stop();
    await fake?.close();
    await catcher?.close();
  });

  for (const vp of [{ width: 390, height: 844 }, { width: 1280, height: 800 }]) {
    it(`a visitor buys the demo pack, gets the mail and downloads the PDF — ${vp.width} px`, async () => {
      const context = await browser!.newContext({ viewport: vp, acceptDownloads: true });
      const page = await context.newPage();
      // The machine is shared; under load a page or the bundle can take a while.
      page.setDefaultTimeout(45_000);
      const pageErrors: string[] = [];
      page.on('pageerror', (e) => pageErrors.push(e.message));
      const shot = (name: string) => page.screenshot({ path: path.join(artifacts, `packs-${vp.width}-${name}.png`), fullPage: true });
      const email = `visitor-${vp.width}-${tag}@test.example.com`;
      try {
        await page.goto(`${base}/packs`);
        await page.getByRole('heading', { name: 'Pattern packs', level: 1 }).waitFor();
        const card = page.getByRole('link', { name: `${paidDemo.title}, 12.00 EUR, by Lanternworks Foam` });
        await card.waitFor();
        await page.getByRole('img', { name: `Cover of ${paidDemo.title}` }).first().waitFor();
        await shot('1-catalogue');
        await card.click();

        await page.getByRole('heading', { name: paidDemo.title, level: 1 }).waitFor();
        await page.getByText('safety data sheet').first().waitFor();
        // An empty address is refused by the shared schema (db/validation.ts emailField) before any request.
        await page.getByRole('button', { name: 'Buy this pack' }).click();
        await page.getByText('Enter an e-mail address like name@example.com').waitFor();
        await page.getByLabel('Your e-mail (the download link is sent here)').fill(email);
        await shot('2-pack-page');
        await page.getByRole('button', { name: 'Buy this pack' }).click();

        // The fake's own pay page (another origin), then back to our pack page.
        await page.waitForURL(`${fake.url}/pay/**`);
        await page.getByText('12.00 EUR').waitFor();
        await shot('3-pay-page');
        await page.getByRole('button', { name: 'Pay' }).click();
        await page.waitForURL(`${base}/packs/${paidDemo.slug}?paid=1`);
        await page.getByText('Thank you — check your e-mail').waitFor();
        await shot('4-returned');

        let mail = catcher.messages().find((m) => m.to.includes(email));
        for (let i = 0; i < 100 && !mail; i++) {
          await new Promise((r) => setTimeout(r, 100));
          mail = catcher.messages().find((m) => m.to.includes(email));
        }
        expect(mail, 'the receipt reached the mail catcher').toBeTruthy();
        const link = /https?:\/\/\S+\/downloads\/[A-Za-z0-9_-]{43}/.exec(mail!.text)?.[0];
        expect(link?.startsWith(`${base}/downloads/`)).toBe(true);
        expect(mail!.html).toContain(link!);

        await page.goto(link!);
        await page.getByRole('heading', { name: paidDemo.title, level: 1 }).waitFor();
        await page.getByText('5 of 5 downloads left', { exact: false }).waitFor();
        await shot('5-download-page');
        const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download print-set.pdf' }).click()]);
        const saved = await download.path();
        // A PDF file starts with "%PDF-" (ISO 32000-1 §7.5.2).
        expect(readFileSync(saved!).subarray(0, 5).toString('latin1')).toBe('%PDF-');
        expect(download.suggestedFilename()).toBe('print-set.pdf');
        await page.reload();
        await page.getByText('4 of 5 downloads left', { exact: false }).waitFor();
        expect(pageErrors).toEqual([]);
      } finally {
        await context.close();
      }
    }, 150_000);
  }
});

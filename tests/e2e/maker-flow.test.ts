/**
 * The maker's whole flow in a browser against the real server, worker and database (issue 5, "Tests"), as a new
 * person would do it: sign up, start a build, upload a sculpt with the wearer's head measures, watch the upload
 * and the processing job, land in the studio, find the processed version on the build page (with the crew panel
 * and the pack form an owner gets) and the build's stage in the builds table — at 390 × 844 and 1280 × 800. Then,
 * on the 1280 px build: click three points on the 3D canvas to make a seam, see the pieces the saved seam makes,
 * make a print set on Sheets & print and download its PDF, and at 390 px tick a piece on the bench view that is
 * still ticked after a reload. Screenshots in tests/artifacts/maker-*.png (ignored by git) for a person to look at.
 *
 * The sculpt is the project's own demo helmet shell (geometry/shapes/helmet-shell.ts, 210 × 240 × 150 mm dome
 * with a 30 mm brim) written as OBJ text (bench/studio-api.ts helmetObj), so the expected bounding box is known:
 * x and y are the dome plus the brim on both sides (210 + 60, 240 + 60 mm), z is the dome height plus the brim's
 * drop (150 + 12 mm).
 */
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { helmetObj } from '../../bench/studio-api';
import { appProcesses, artifacts, freePort, haveDist, launchBrowser } from './browser-harness';
import { createOwnDatabase, type OwnDatabase } from './own-database';

const app = appProcesses();
let base = '';
let browser: Browser | null = null;
let modelPath = '';
let tmp = '';
let ownDatabase: OwnDatabase | null = null;

/** Where the 1280 px run left its build: the session (cookies) and the build's studio address. */
let wideFlow: { storage: Awaited<ReturnType<import('playwright-core').BrowserContext['storageState']>>; studioUrl: string } | null = null;

/** Waits for the studio's first frame with the mesh drawn (a performance mark the studio sets, components/studio). */
async function waitForMeshFrame(page: Page): Promise<void> {
  await page.waitForFunction(() => performance.getEntriesByName('studio-first-mesh-frame').length > 0, null, { timeout: 60_000 });
  // Let the demand-driven canvas settle after its first frame (camera fit, colours), as the studio test does.
  await page.waitForTimeout(500);
}

describe.skipIf(!haveDist)(
  haveDist ? 'maker flow in a browser' : 'maker flow in a browser — SKIPPED: dist/ is missing; run `npm run web:build` (npm test does it)',
  () => {
    beforeAll(async () => {
      const databaseUrl = process.env.DATABASE_URL;
      if (!databaseUrl) throw new Error('DATABASE_URL is not set: run the browser test through `npm test`, which starts the test database.');
      mkdirSync(artifacts, { recursive: true });
      tmp = mkdtempSync(path.join(os.tmpdir(), 'ss-maker-flow-'));
      // A database of this suite's own, so its worker takes only this suite's jobs.
      ownDatabase = await createOwnDatabase(databaseUrl, 'ss_maker_e2e');
      modelPath = path.join(tmp, 'demo-helm.obj');
      writeFileSync(modelPath, helmetObj().text);
      const port = await freePort();
      base = `http://127.0.0.1:${port}`;
      const env = {
        ...process.env,
        PORT: String(port),
        WEB_ROOT: 'dist',
        SESSION_SECRET: 'e2e-session-secret-that-is-long-enough-0123456789',
        DATABASE_URL: ownDatabase.url,
        STORAGE: 'disk',
        FILES_DIR: path.join(tmp, 'files'),
        LOG_LEVEL: 'warn',
        // Every browser test signs up from loopback; the sign-up limit (10 an hour) is the API tests' business.
        SIGNUP_RATE_LIMIT: '1000',
      };
      app.start('server', 'server/index.ts', env);
      await app.waitForHealth(`${base}/api/health`, 60_000);
      // The worker takes the sculpt-process job from the same PostgreSQL queue, as `npm start` runs it.
      app.start('worker', 'server/worker.ts', env);
      browser = await launchBrowser();
    }, 90_000);

    afterAll(async () => {
      await browser?.close();
      await app.stop();
      await ownDatabase?.drop();
      if (tmp) rmSync(tmp, { recursive: true, force: true });
    });

    for (const vp of [
      { width: 390, height: 844, wide: false },
      { width: 1280, height: 800, wide: true },
    ]) {
      it(`signs up, starts a build, uploads a sculpt and waits for processing — ${vp.width} px`, async () => {
        const context = await browser!.newContext({ viewport: { width: vp.width, height: vp.height } });
        const page = await context.newPage();
        const pageErrors: string[] = [];
        page.on('pageerror', (e) => pageErrors.push(e.message));
        const shot = (name: string) => page.screenshot({ path: path.join(artifacts, `maker-${vp.width}-${name}.png`), fullPage: true });
        const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
        try {
          await page.goto(base + '/sign-up');
          await page.getByLabel('Your name').fill(`Foam Maker ${vp.width}`);
          await page.getByLabel('E-mail').fill(`maker-flow-${vp.width}-${stamp}@example.com`);
          await page.getByLabel('Password').fill('closed-cell-eva-6mm');
          await page.getByRole('button', { name: 'Create account' }).click();
          await page.getByRole('heading', { name: 'Builds', level: 1 }).waitFor();

          await page.getByLabel('Build name').fill('Demo helm');
          await page.getByRole('button', { name: 'Start build' }).click();
          const listRole = vp.wide ? 'table' : 'list';
          const list = page.getByRole(listRole, { name: 'Builds' });
          await list.getByRole('link', { name: 'Demo helm', exact: true }).waitFor();
          // A new build has no sculpt (server/builds/build-progress.ts stage no-sculpt).
          await list.getByText('No sculpt yet').waitFor();
          await list.getByRole('link', { name: 'Demo helm', exact: true }).click();
          await page.getByRole('heading', { name: 'Demo helm', level: 1 }).waitFor();
          await page.getByText('No sculpt yet. Upload').waitFor();
          await page.getByRole('button', { name: 'Upload a sculpt' }).click();
          await page.getByRole('heading', { name: 'Upload a sculpt', level: 1 }).waitFor();

          // A file of the wrong type is refused before sending, with its name in the message.
          await page.getByLabel(/^Model file/).setInputFiles({ name: 'helm.fbx', mimeType: 'application/octet-stream', buffer: Buffer.from('not a model') });
          await page.getByText('“helm.fbx” is not a model file').waitFor();

          await page.getByLabel(/^Model file/).setInputFiles(modelPath);
          // Measured in the page's worker before upload: the helmet's box, 270 × 300 × 162 mm.
          const before = page.getByLabel('Size before scaling');
          await before.waitFor();
          expect(await before.textContent()).toBe('270 mm × 300 mm × 162 mm');
          // Centimetres make it ten times larger (1 cm = 10 mm).
          await page.getByRole('radio', { name: 'centimetres' }).click();
          await expect.poll(() => before.textContent(), { timeout: 10_000 }).toBe('2.70 m × 3.00 m × 1.62 m');
          await page.getByRole('radio', { name: 'millimetres' }).click();
          await expect.poll(() => before.textContent(), { timeout: 10_000 }).toBe('270 mm × 300 mm × 162 mm');
          await page.getByLabel('Head circumference (mm)').fill('570');
          await page.getByLabel('Size after scaling').waitFor();
          await shot('1-upload-form');

          await page.getByRole('button', { name: 'Upload sculpt' }).click();
          // The processing job runs in the worker; when it is done the page opens the studio.
          await page.waitForURL((u) => u.pathname.endsWith('/studio'), { timeout: 120_000 });
          const studioUrl = page.url();
          await waitForMeshFrame(page);
          await shot('2-studio');

          await page.goBack();
          await page.goto(base + '/builds');
          await list.getByRole('link', { name: 'Demo helm', exact: true }).click();
          const versions = page.getByRole('list', { name: 'Sculpt versions' });
          const v1 = versions.getByRole('listitem', { name: 'Sculpt version 1' });
          await v1.getByText('Ready').waitFor({ timeout: 30_000 });
          await v1.getByText('demo-helm.obj', { exact: false }).waitFor();
          await v1.getByText(/^Size /).waitFor();
          // The owner manages the crew from the build page (invite form) and opens the pack form from it.
          await page.getByRole('heading', { name: 'Crew and clients', level: 2 }).waitFor();
          await page.getByRole('list', { name: 'Members' }).getByText(`Foam Maker ${vp.width} (you)`).waitFor();
          await shot('3-build-page');
          // The page scrolls inside its own view, so a full-page shot stops at the window: scroll to the crew.
          await page.getByRole('heading', { name: 'Crew and clients', level: 2 }).scrollIntoViewIfNeeded();
          await shot('3b-build-page-crew');
          await page.getByRole('button', { name: 'Publish a pattern pack' }).click();
          await page.getByRole('heading', { name: 'Pattern packs', level: 2 }).scrollIntoViewIfNeeded();
          await page.getByText('No finished print set yet.').waitFor();
          await shot('3c-build-page-packs');

          // A processed sculpt queues its first pattern (no seams yet: the whole shell as one piece), so the
          // build moves on to "Pieces ready" (server/builds/build-progress.ts buildStage); the table polls.
          await page.goto(base + '/builds');
          await list.getByText('Pieces ready').waitFor({ timeout: 120_000 });
          await shot('4-builds');
          expect(pageErrors).toEqual([]);
          if (vp.wide) wideFlow = { storage: await context.storageState(), studioUrl };
        } catch (e) {
          await shot('failure').catch(() => undefined);
          throw new Error(`${(e as Error).message}\n${app.logs()}`);
        } finally {
          await context.close();
        }
      }, 240_000);
    }

    it('marks a seam with three clicks on the canvas, sees its pieces, downloads the PDF (1280 px) and ticks a piece on the bench (390 px)', async () => {
      if (!wideFlow) throw new Error('the 1280 px sign-up and upload run above failed, so there is no build to carry on with');
      const context = await browser!.newContext({ viewport: { width: 1280, height: 800 }, storageState: wideFlow.storage });
      const page = await context.newPage();
      const pageErrors: string[] = [];
      page.on('pageerror', (e) => pageErrors.push(e.message));
      const shot = (name: string) => page.screenshot({ path: path.join(artifacts, `maker-${page.viewportSize()?.width ?? 0}-${name}.png`), fullPage: true });
      const studio = new URL(wideFlow.studioUrl);
      const buildId = studio.pathname.split('/')[2];
      const shopId = studio.searchParams.get('shop') ?? '';
      const api = `${base}/api/shops/${shopId}/builds/${buildId}`;
      try {
        await page.goto(wideFlow.studioUrl);
        await waitForMeshFrame(page);
        await page.getByRole('button', { name: 'Draw seams' }).click();
        const box = (await page.locator('canvas').first().boundingBox())!;
        // Three points across the helm's dome, which fills the middle of the fitted view (as in the studio test).
        const points: [number, number][] = [
          [0.4, 0.42],
          [0.5, 0.34],
          [0.6, 0.42],
        ];
        for (let i = 0; i < points.length; i++) {
          await page.mouse.click(box.x + points[i][0] * box.width, box.y + points[i][1] * box.height);
          await expect.poll(() => page.getByRole('button', { name: 'Finish seam' }).innerText(), { timeout: 15_000 }).toContain(`(${i + 1})`);
        }
        await shot('5-seam-drawn');
        await page.getByRole('button', { name: 'Finish seam' }).click();
        await expect.poll(() => page.getByText('1 seam', { exact: true }).count(), { timeout: 10_000 }).toBe(1);
        await expect.poll(() => page.getByRole('status').filter({ hasText: 'Saved' }).count(), { timeout: 15_000 }).toBe(1);
        // The first save of a new sculpt's seams is revision 1 (CONTRACTS.md: PUT seams raises it by one), and
        // the path follows mesh edges through the three picks, so it has at least three vertices.
        const sculpts = (await (await context.request.get(`${api}/sculpts`)).json()).sculpts as { id: string }[];
        const seams = await context.request.get(`${api}/sculpts/${sculpts[0].id}/seams`);
        expect(seams.status()).toBe(200);
        const saved = (await seams.json()).seams as { revision: number; seams: { path: number[] }[] };
        expect(saved.revision).toBe(1);
        expect(saved.seams).toHaveLength(1);
        expect(saved.seams[0].path.length).toBeGreaterThanOrEqual(3);

        // The save queued a pattern; when its job is done the pieces board beside the model lists the pieces.
        await expect.poll(() => page.getByText(/^\d+ pieces? from seam revision 1\.$/).count(), { timeout: 120_000 }).toBe(1);
        await page.getByRole('list', { name: 'Pattern pieces' }).getByRole('button', { name: /^Piece A\b/ }).first().waitFor();
        await shot('6-pieces');

        // Sheets & print from the build page: a PDF print set made by the worker, then downloaded.
        await page.goto(`${base}/builds/${buildId}?shop=${shopId}`);
        await page.getByRole('button', { name: 'Open sheets and print' }).click();
        await page.getByRole('button', { name: 'Make print set' }).click();
        const pdfLink = page.getByRole('link', { name: 'Download Print set (PDF)' });
        await pdfLink.waitFor({ timeout: 120_000 });
        await shot('7-sheets');
        const [download] = await Promise.all([page.waitForEvent('download'), pdfLink.click()]);
        expect(download.suggestedFilename()).toBe('print-set.pdf');
        // ISO 32000-1 §7.5.2: a PDF file begins with the header line %PDF-.
        expect(readFileSync((await download.path())!).subarray(0, 5).toString('latin1')).toBe('%PDF-');

        // The bench view on a phone: tick the first piece as cut; the tick is stored and survives a reload.
        await page.setViewportSize({ width: 390, height: 844 });
        await page.goto(`${base}/builds/${buildId}?shop=${shopId}`);
        await page.getByRole('button', { name: 'Open the bench view' }).click();
        await page.getByRole('heading', { name: 'Bench', level: 1 }).waitFor();
        const tick = page.getByRole('checkbox', { name: 'Piece A cut' });
        await tick.waitFor();
        await expect(tick.getAttribute('aria-checked')).resolves.toBe('false');
        const stored = page.waitForResponse((r) => r.url().endsWith('/pieces/A/progress') && r.request().method() === 'PATCH');
        await tick.click();
        expect((await stored).status()).toBe(200);
        await expect(tick.getAttribute('aria-checked')).resolves.toBe('true');
        await page.reload();
        const again = page.getByRole('checkbox', { name: 'Piece A cut' });
        await again.waitFor();
        await expect(again.getAttribute('aria-checked')).resolves.toBe('true');
        await shot('8-bench');
        expect(pageErrors).toEqual([]);
      } catch (e) {
        await shot('failure-2').catch(() => undefined);
        throw new Error(`${(e as Error).message}\n${app.logs()}`);
      } finally {
        await context.close();
      }
    }, 420_000);
  },
);

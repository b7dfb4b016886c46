/**
 * Browser test of the studio against the real server, worker and database: a fresh maker's build with a
 * processed sculpt (made through the API in set-up: sign up, shop, build, OBJ upload, processing job), then in
 * Chromium: click three points on the 3D canvas, finish the seam, see it saved, reload and find it again, see
 * the pieces made from it; the same build at phone width with the flat pieces one toggle away. Screenshots go to
 * tests/artifacts/ (ignored by git) for a person to look at.
 *
 * Expected behaviour comes from the studio brief and CONTRACTS.md (PUT seams raises the revision by one; a save
 * queues a pattern of the sculpt); window sizes 390 × 844 and 1280 × 800 as in the app-shell test.
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appProcesses, artifacts, freePort, haveDist, launchBrowser } from './browser-harness';
import { createOwnDatabase, type OwnDatabase } from './own-database';
import { createStudioFixture, fetchSeams, replaceSeams, type StudioFixture } from '../../bench/studio-api';

const app = appProcesses();
let ownDatabase: OwnDatabase | null = null;
let filesDir = '';
let browser: Browser | null = null;
let fixture: StudioFixture | null = null;

async function openStudio(width: number, height: number): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const f = fixture!;
  const context = await browser!.newContext({ viewport: { width, height } });
  const name = f.cookie.slice(0, f.cookie.indexOf('='));
  await context.addCookies([{ name, value: f.cookie.slice(name.length + 1).split(';')[0], url: f.base }]);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto(`${f.base}/builds/${f.buildId}/studio?shop=${f.shopId}`);
  await waitForMeshFrame(page);
  return { context, page, errors };
}

async function waitForMeshFrame(page: Page): Promise<void> {
  try {
    await page.waitForFunction(() => performance.getEntriesByName('studio-first-mesh-frame').length > 0, null, { timeout: 60_000 });
  } catch (e) {
    await page.screenshot({ path: path.join(artifacts, `studio-failed-${page.viewportSize()?.width ?? 0}.png`) });
    const text = (await page.locator('body').innerText()).slice(0, 1500);
    throw new Error(`the studio drew no frame with the mesh within 60 s; the page says:\n${text}\nserver:\n${app.logs(1500)}`, { cause: e });
  }
  // Let the demand-driven canvas settle after its first frame (camera fit, colours).
  await page.waitForTimeout(500);
}

describe.skipIf(!haveDist)(haveDist ? 'studio in a browser' : 'studio in a browser — SKIPPED: dist/ is missing; run `npm run web:build`', () => {
  beforeAll(async () => {
    const databaseUrl = process.env.DATABASE_URL;
    if (!databaseUrl) throw new Error('DATABASE_URL is not set: run the browser test through `npm test`, which starts the test database.');
    mkdirSync(artifacts, { recursive: true });
    ownDatabase = await createOwnDatabase(databaseUrl, 'ss_studio_e2e');
    filesDir = mkdtempSync(path.join(tmpdir(), 'ss-studio-e2e-'));
    const port = await freePort();
    const env = {
      ...process.env,
      PORT: String(port),
      WEB_ROOT: 'dist',
      // A database and file store of this suite's own, so its worker takes only this suite's jobs.
      STORAGE: 'disk',
      FILES_DIR: filesDir,
      SESSION_SECRET: 'e2e-session-secret-that-is-long-enough-0123456789',
      SIGNUP_RATE_LIMIT: '1000',
      DATABASE_URL: ownDatabase.url,
    };
    app.start('server', 'server/index.ts', env);
    app.start('worker', 'server/worker.ts', env);
    await app.waitForHealth(`http://127.0.0.1:${port}/api/health`, 60_000);
    try {
      fixture = await createStudioFixture(`http://127.0.0.1:${port}`, {}, 120_000);
    } catch (e) {
      throw new Error(`${(e as Error).message}\nserver and worker output:\n${app.logs(4000)}`, { cause: e });
    }
    browser = await launchBrowser();
  }, 200_000);

  afterAll(async () => {
    await browser?.close();
    await app.stop();
    await ownDatabase?.drop();
    if (filesDir) rmSync(filesDir, { recursive: true, force: true });
  });

  it('draws a seam through three clicked points, saves it, keeps it after a reload and shows the pieces — 1280 px', async () => {
    const { context, page, errors } = await openStudio(1280, 800);
    await page.getByRole('button', { name: 'Draw seams' }).click();
    const canvas = page.locator('canvas').first();
    const box = (await canvas.boundingBox())!;
    // Three points across the helm's dome, which fills the middle of the fitted view.
    const points: [number, number][] = [
      [0.4, 0.42],
      [0.5, 0.34],
      [0.6, 0.42],
    ];
    for (let i = 0; i < points.length; i++) {
      await page.mouse.click(box.x + points[i][0] * box.width, box.y + points[i][1] * box.height);
      await expect.poll(() => page.getByRole('button', { name: 'Finish seam' }).innerText(), { timeout: 15_000 }).toContain(`(${i + 1})`);
    }
    await page.screenshot({ path: path.join(artifacts, 'studio-1280-1-drawing.png') });
    await page.getByRole('button', { name: 'Finish seam' }).click();
    await expect.poll(() => page.getByText('1 seam', { exact: true }).count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Saved' }).count(), { timeout: 15_000 }).toBe(1);

    // The server holds one seam, revision 1, whose path runs along the mesh through the three picks.
    const saved = await fetchSeams(fixture!);
    expect(saved.revision).toBe(1);
    expect(saved.seams).toHaveLength(1);
    expect(saved.seams[0].path.length).toBeGreaterThanOrEqual(3);

    await page.reload();
    await waitForMeshFrame(page);
    await expect.poll(() => page.getByText('1 seam', { exact: true }).count(), { timeout: 15_000 }).toBe(1);
    // The save queued a pattern; once done the pieces board lists its pieces beside the 3D view.
    await expect.poll(() => page.getByText(/pieces? from seam revision 1\./).count(), { timeout: 90_000 }).toBe(1);
    await page.reload();
    await waitForMeshFrame(page);
    await page.screenshot({ path: path.join(artifacts, 'studio-1280-2-pieces.png') });
    // The seam engine answers from its web worker, not the page's thread.
    expect(await page.evaluate(() => performance.getEntriesByName('studio-seam-worker-ready').length)).toBe(1);

    // Stretch map with its legend in percent.
    await page.getByRole('button', { name: 'Show the stretch map' }).click();
    await expect.poll(() => page.getByRole('img', { name: /Stretch map legend/ }).count(), { timeout: 5_000 }).toBe(1);
    await page.screenshot({ path: path.join(artifacts, 'studio-1280-3-stretch.png') });
    await page.getByRole('button', { name: 'Show the stretch map' }).click();

    // Suggested pieces from the stretch budget, accepted, then undone and redone.
    await page.getByRole('button', { name: 'Suggest pieces' }).click();
    await expect.poll(() => page.getByRole('region', { name: 'Suggested seams' }).count(), { timeout: 60_000 }).toBe(1);
    await page.screenshot({ path: path.join(artifacts, 'studio-1280-4-suggested.png') });
    await page.getByRole('button', { name: 'Accept all suggested seams' }).click();
    const countText = () => page.getByText(/^\d+ seams?( · mirrored)?$/).first().innerText();
    await expect.poll(countText, { timeout: 5_000 }).not.toBe('1 seam');
    const accepted = await countText();
    await page.getByRole('button', { name: 'Undo' }).click();
    await expect.poll(countText, { timeout: 5_000 }).toBe('1 seam');
    await page.getByRole('button', { name: 'Redo' }).click();
    await expect.poll(countText, { timeout: 5_000 }).toBe(accepted);
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Saved' }).count(), { timeout: 15_000 }).toBe(1);
    expect((await fetchSeams(fixture!)).seams.length).toBe(Number(accepted.split(' ')[0]));

    // Mirror: the helm is mirror-symmetric, so every seam off the plane gets a copy and the count says so.
    await page.getByRole('button', { name: 'Mirror seams across the symmetry plane' }).click();
    await expect.poll(countText, { timeout: 30_000 }).toMatch(/ · mirrored$/);
    const mirrored = Number((await countText()).split(' ')[0]);
    expect(mirrored).toBeGreaterThan(Number(accepted.split(' ')[0]));
    await page.getByRole('button', { name: 'Mirror seams across the symmetry plane' }).click();
    await expect.poll(countText, { timeout: 5_000 }).toBe(accepted);
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Saved' }).count(), { timeout: 15_000 }).toBe(1);

    // The save queued a pattern of the accepted seams: its pieces colour the model and carry seam badges.
    await expect.poll(() => page.getByText(/^([2-9]|\d\d+) pieces from seam revision \d+\.$/).count(), { timeout: 120_000 }).toBe(1);
    await waitForMeshFrame(page);
    await page.getByRole('button', { name: /^Piece A\b/ }).first().click();
    await page.waitForTimeout(500);
    await page.screenshot({ path: path.join(artifacts, 'studio-1280-5-pieces.png') });

    await page.keyboard.press('?');
    await expect.poll(() => page.getByRole('dialog', { name: 'Studio keyboard shortcuts' }).isVisible(), { timeout: 5_000 }).toBe(true);
    await page.screenshot({ path: path.join(artifacts, 'studio-1280-6-keys.png') });
    await page.keyboard.press('Escape');

    // The pack's cover picture from the 3D view: a PNG (signature per the PNG spec, ISO/IEC 15948 §5.2) of the
    // drawn model, not a blank frame — more than one colour must appear in it.
    await page.getByRole('button', { name: "Take this view as the pattern pack's cover picture" }).click();
    await expect.poll(() => page.getByText('Cover picture taken').isVisible(), { timeout: 5_000 }).toBe(true);
    const cover = await page.evaluate(async (buildId) => {
      const url = sessionStorage.getItem(`sheetsmith-pack-cover:${buildId}`) ?? '';
      const img = new Image();
      img.src = url;
      await img.decode();
      const c = document.createElement('canvas');
      c.width = img.width;
      c.height = img.height;
      const ctx = c.getContext('2d')!;
      ctx.drawImage(img, 0, 0);
      const data = ctx.getImageData(0, 0, c.width, c.height).data;
      const colours = new Set<number>();
      for (let i = 0; i < data.length && colours.size < 50; i += 4 * 97) colours.add((data[i] << 16) | (data[i + 1] << 8) | data[i + 2]);
      const head = atob(url.split(',')[1] ?? '').slice(0, 8);
      return { head: Array.from(head, (ch) => ch.charCodeAt(0)), colours: colours.size, width: img.width };
    }, fixture!.buildId);
    expect(cover.head).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    expect(cover.width).toBeGreaterThan(100);
    expect(cover.colours).toBeGreaterThan(5);
    expect(errors).toEqual([]);
    await context.close();
  }, 240_000);

  it('shows the saved seams on a phone, switches to the flat pieces, and loads the other editor\'s seams on a conflict — 390 px', async () => {
    const { context, page, errors } = await openStudio(390, 844);
    await expect.poll(() => page.getByText(/^\d+ seams?( · mirrored)?$/).count(), { timeout: 15_000 }).toBe(1);
    await page.screenshot({ path: path.join(artifacts, 'studio-390-1-view.png') });
    await page.getByRole('button', { name: 'Flat pieces' }).click();
    await expect.poll(() => page.getByRole('list', { name: 'Pattern pieces' }).count(), { timeout: 15_000 }).toBe(1);
    await page.screenshot({ path: path.join(artifacts, 'studio-390-2-pieces.png') });

    // Someone else saves while this page is open: this page's next save is refused (409) and theirs is loaded.
    const current = await fetchSeams(fixture!);
    await replaceSeams(fixture!, current.revision, [current.seams[0]]);
    await page.getByRole('button', { name: 'Mirror seams across the symmetry plane' }).click();
    await expect.poll(() => page.getByRole('status').filter({ hasText: 'Someone else changed the seams' }).count(), { timeout: 30_000 }).toBe(1);
    await expect.poll(() => page.getByText('1 seam', { exact: true }).count(), { timeout: 5_000 }).toBe(1);
    await page.screenshot({ path: path.join(artifacts, 'studio-390-3-conflict.png') });
    expect(errors).toEqual([]);
    await context.close();
  }, 120_000);
});

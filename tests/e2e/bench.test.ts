/**
 * Browser test of the pieces, sheets & print and bench pages against the real server and database, with the
 * demo helmet's build made by the same functions the workers run (db/seed-demo-build.ts): a crew member on a
 * 390 px phone looks up a seam by number, ticks a piece, reloads and finds it still ticked, sees another
 * member's tick arrive, sees a refused tick rolled back, and opens the safety cautions; a client sees the
 * checklist read-only. Screenshots of the three pages at 390 and 1280 px go to tests/artifacts/ (ignored by git).
 *
 * Expected values come from the stored pattern document (the engine's output for this build) and the API
 * contract (CONTRACTS.md: PATCH …/pieces/:label/progress; the bench refreshes every 10 s, issue 5 point 6).
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { and, desc, eq } from 'drizzle-orm';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, createPool } from '../../db/client';
import { buildPieces } from '../../db/schema-bench';
import { builds, memberships, shops, users } from '../../db/schema-core';
import { patterns } from '../../db/schema-sculpts';
import { seedDemoBuild } from '../../db/seed-demo-build';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { hashPassword } from '../../server/auth/passwords';
import { runPatternJob } from '../../server/patterns/pattern-job';
import { runPrintSetJob } from '../../server/print-sets/print-set-job';
import { runSheetPlanJob } from '../../server/sheet-plans/sheet-plan-job';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { appProcesses, artifacts, freePort, haveDist, launchBrowser } from './browser-harness';
import { createOwnDatabase, type OwnDatabase } from './own-database';

const PASSWORD = 'offcut-bevel-30deg';

const app = appProcesses();
let base = '';
let browser: Browser | null = null;
let filesDir = '';
let ownDatabase: OwnDatabase | null = null;
let pool: ReturnType<typeof createPool> | null = null;
let db: ReturnType<typeof createDb>;
const people = { owner: '', crew: '', client: '' };
const emails = { owner: '', crew: '', client: '' };
let shopId = '';
let buildId = '';
let doc: PatternDoc;

async function signedIn(who: keyof typeof emails, width: number, height: number): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await browser!.newContext({ viewport: { width, height } });
  const res = await context.request.post(`${base}/api/auth/signin`, { data: { email: emails[who], password: PASSWORD } });
  expect(res.status(), await res.text()).toBe(200);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  return { context, page, errors };
}

const href = (section: string) => `${base}/builds/${buildId}/${section}?shop=${shopId}`;
/**
 * Saves a screenshot of the whole page. The app scrolls inside its own scroll view, so a full-page shot is taken
 * by making the window as tall as the content for a moment.
 */
async function shot(page: Page, name: string): Promise<void> {
  const size = page.viewportSize()!;
  const tall = await page.evaluate(() => Math.max(...Array.from(document.querySelectorAll('div')).map((d) => d.scrollHeight)));
  await page.setViewportSize({ width: size.width, height: Math.min(Math.max(size.height, tall), 6000) });
  await page.waitForTimeout(150);
  await page.screenshot({ path: path.join(artifacts, `screens-${name}.png`) });
  await page.setViewportSize(size);
}

describe.skipIf(!haveDist)(
  haveDist ? 'pieces, sheets and bench pages in a browser' : 'pieces, sheets and bench pages — SKIPPED: dist/ is missing; run `npm run web:build` (npm test does it)',
  () => {
    beforeAll(async () => {
      const databaseUrl = process.env.DATABASE_URL;
      if (!databaseUrl) throw new Error('DATABASE_URL is not set: run the browser test through `npm test`, which starts the test database.');
      mkdirSync(artifacts, { recursive: true });
      filesDir = mkdtempSync(path.join(tmpdir(), 'ss-bench-e2e-'));
      // A database of this file's own: the jobs it queues (pattern, sheet plan, print set) are run here, in the
      // test process, and a worker of another browser suite sharing the database's queue must not take them
      // (it would look for this build's files in its own file store).
      ownDatabase = await createOwnDatabase(databaseUrl, 'ss_bench_e2e');
      pool = createPool(ownDatabase.url, 4);
      db = createDb(pool);
      const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
      const hash = await hashPassword(PASSWORD);
      for (const who of ['owner', 'crew', 'client'] as const) {
        emails[who] = `${who}-${stamp}@bench.example.com`;
        const [u] = await db.insert(users).values({ email: emails[who], name: `Bench ${who}`, passwordHash: hash }).returning({ id: users.id });
        people[who] = u.id;
      }
      const [shop] = await db.insert(shops).values({ name: `Bench shop ${stamp}` }).returning({ id: shops.id });
      shopId = shop.id;
      await db.insert(memberships).values([
        { userId: people.owner, shopId, role: 'owner' },
        { userId: people.crew, shopId, role: 'editor' },
        { userId: people.client, shopId, role: 'viewer' },
      ]);
      const [build] = await db.insert(builds).values({ shopId, name: 'Bench test helm' }).returning({ id: builds.id });
      buildId = build.id;
      await seedDemoBuild(db, localDiskStore(filesDir), { shopId, buildId, ownerId: people.owner, crewId: people.crew });
      const [p] = await db.select({ doc: patterns.doc }).from(patterns).where(eq(patterns.buildId, buildId));
      doc = p.doc as PatternDoc;

      const port = await freePort();
      base = `http://127.0.0.1:${port}`;
      app.start('server', 'server/index.ts', {
        ...process.env,
        PORT: String(port),
        WEB_ROOT: 'dist',
        FILES_DIR: filesDir,
        STORAGE: 'disk',
        SESSION_SECRET: 'e2e-session-secret-that-is-long-enough-0123456789',
        DATABASE_URL: ownDatabase.url,
      });
      await app.waitForHealth(`${base}/api/health`, 60_000);
      browser = await launchBrowser();
    });

    afterAll(async () => {
      await browser?.close();
      await app.stop();
      await pool?.end();
      if (filesDir) rmSync(filesDir, { recursive: true, force: true });
      await ownDatabase?.drop();
    });

    it('bench at 390 px: seam look-up, a tick that survives a reload, another member\'s tick, a refused tick rolled back, notes, cautions', async () => {
      const { context, page, errors } = await signedIn('crew', 390, 844);
      try {
        await page.goto(href('bench'));
        await page.getByRole('heading', { name: 'Bench', level: 1 }).waitFor();

        // Seam look-up: the first seam of the stored pattern, its two pieces and the bevel cut on each edge.
        const seam = doc.seams[0];
        const edgeOf = (piece: string, side: number) => doc.pieces.find((p) => p.label === piece)?.seamEdges?.find((e) => e.seam === seam.label && e.side === side && (e.copy ?? 0) === 0);
        const sides = (seam.pieces.length === 1 ? [seam.pieces[0], seam.pieces[0]] : seam.pieces).map((piece, side) => ({ piece, bevel: edgeOf(piece, side)?.bevelDeg ?? seam.bevel.mean }));
        await page.getByRole('textbox', { name: 'Seam number' }).fill(`${seam.label}`);
        await page.getByText(`Seam ${seam.label} joins`).waitFor();
        for (const s of sides) {
          // Shown to the half degree, as formatBevel does (a value a blade guide can be set to).
          const half = Math.round(s.bevel * 2) / 2;
          await expect(page.getByLabel(`Bevel ${Number.isInteger(half) ? half : half.toFixed(1)}° on piece ${s.piece}`, { exact: false }).first().isVisible()).resolves.toBe(true);
        }
        await expect(page.getByText(seam.convex ? '△ Outside corner' : '▲ Inside corner', { exact: false }).isVisible()).resolves.toBe(true);
        await page.getByRole('textbox', { name: 'Seam number' }).fill('999');
        await page.getByRole('alert').filter({ hasText: 'No seam 999' }).waitFor();
        await page.getByRole('textbox', { name: 'Seam number' }).fill(`${seam.label}`);
        await shot(page, 'bench-390');

        // Tick: the first piece not yet glued (the seed cut three pieces and shaped one; none is glued).
        const label = doc.pieces[0].label;
        const box = page.getByRole('checkbox', { name: `Piece ${label} glued` });
        await expect(box.getAttribute('aria-checked')).resolves.toBe('false');
        const saved = page.waitForResponse((r) => r.url().endsWith(`/pieces/${label}/progress`) && r.request().method() === 'PATCH');
        await box.click();
        // The optimistic tick shows before the server answers; on a loaded machine the re-render can trail the click.
        await expect.poll(() => box.getAttribute('aria-checked'), { timeout: 5_000 }).toBe('true');
        expect((await saved).status()).toBe(200);
        const [row] = await db.select({ glued: buildPieces.glued }).from(buildPieces).where(and(eq(buildPieces.buildId, buildId), eq(buildPieces.label, label)));
        expect(row.glued).toBe(true);
        await page.reload();
        const again = page.getByRole('checkbox', { name: `Piece ${label} glued` });
        await again.waitFor();
        await expect(again.getAttribute('aria-checked')).resolves.toBe('true');

        // Another member's tick arrives without a reload (the bench refreshes every 10 s).
        const other = doc.pieces[1].label;
        const owner = await browser!.newContext();
        const signIn = await owner.request.post(`${base}/api/auth/signin`, { data: { email: emails.owner, password: PASSWORD } });
        expect(signIn.status()).toBe(200);
        const patch = await owner.request.patch(`${base}/api/shops/${shopId}/builds/${buildId}/pieces/${other}/progress`, { data: { glued: true } });
        expect(patch.status(), await patch.text()).toBe(200);
        await owner.close();
        await page.waitForFunction(
          (name) => document.querySelector(`[aria-label="${name}"]`)?.getAttribute('aria-checked') === 'true',
          `Piece ${other} glued`,
          { timeout: 15_000 },
        );

        // A refused tick goes back and says why (the server is made to answer 500 for this one request).
        const third = doc.pieces[2].label;
        await page.route(`**/pieces/${third}/progress`, (route) =>
          route.fulfill({ status: 500, contentType: 'application/json', body: JSON.stringify({ error: { code: 'INTERNAL', message: 'The checklist could not be saved.' } }) }),
        );
        const refused = page.getByRole('checkbox', { name: `Piece ${third} glued` });
        await refused.click();
        await page.getByRole('alert').filter({ hasText: 'The checklist could not be saved.' }).waitFor();
        await expect(refused.getAttribute('aria-checked')).resolves.toBe('false');
        await page.unroute(`**/pieces/${third}/progress`);

        // Notes: the seeded note on the first piece is listed; an empty note is refused with the schema's message;
        // a new note is added and listed.
        await page.getByRole('button', { name: new RegExp(`^Notes on piece ${label} `) }).click();
        await page.getByText('Crown piece: heat-form the dome before gluing the side seams.').waitFor();
        await page.getByRole('button', { name: `Add note to piece ${label}` }).click();
        await page.getByText('write something in the note').waitFor();
        await page.getByRole('textbox', { name: `New note on piece ${label}` }).fill('Left edge needs a second pass with the blade.');
        await page.getByRole('button', { name: `Add note to piece ${label}` }).click();
        await page.getByRole('list', { name: `Notes on piece ${label}` }).getByText('Left edge needs a second pass with the blade.').waitFor();

        // The cautions, one tap away: ventilation, respirator for organic vapours, and the safety data sheet.
        await page.getByRole('button', { name: 'Safety cautions' }).click();
        const dialog = page.getByRole('dialog', { name: 'Safety cautions' });
        await dialog.waitFor();
        const text = await dialog.innerText();
        expect(text).toMatch(/respirator/i);
        expect(text).toMatch(/organic vapour/i);
        expect(text).toMatch(/safety data sheet/i);
        expect(text).toMatch(/heat-resistant|heat-proof/i);
        await shot(page, 'bench-390-cautions');
        await page.getByRole('button', { name: 'Close the cautions', exact: true }).click();
        await dialog.waitFor({ state: 'hidden' });
        expect(errors).toEqual([]);
      } catch (e) {
        await shot(page, 'bench-390-failure').catch(() => undefined);
        throw new Error(`${(e as Error).message}\nServer output:\n${app.logs(2000)}`);
      } finally {
        await context.close();
      }
    });

    it('empty and error states: a build without a pattern points to the studio; an unknown build says so', async () => {
      const [bare] = await db.insert(builds).values({ shopId, name: 'Bare build' }).returning({ id: builds.id });
      const { context, page } = await signedIn('crew', 390, 844);
      try {
        for (const section of ['pieces', 'sheets', 'bench']) {
          await page.goto(`${base}/builds/${bare.id}/${section}?shop=${shopId}`);
          await page.getByRole('heading', { name: 'No pattern yet' }).waitFor();
          const studio = page.getByRole('link', { name: 'Open the studio to mark seams' });
          await studio.waitFor();
          expect(await studio.getAttribute('href')).toBe(`/builds/${bare.id}/studio?shop=${shopId}`);
        }
        await shot(page, 'bench-390-empty');
        // A build id that does not exist (a fresh UUID): the API answers 404 and the page says what went wrong.
        await page.goto(`${base}/builds/00000000-0000-4000-8000-000000000000/bench?shop=${shopId}`);
        await page.getByRole('alert').filter({ hasText: 'This build did not open' }).waitFor();
      } finally {
        await context.close();
      }
    });

    it('a client at 390 px sees the checklist, piece settings and sheets read-only', async () => {
      const { context, page } = await signedIn('client', 390, 844);
      try {
        await page.goto(href('bench'));
        const box = page.getByRole('checkbox', { name: `Piece ${doc.pieces[0].label} cut` });
        await box.waitFor();
        await expect(box.getAttribute('aria-disabled')).resolves.toBe('true');
        await page.getByText('the checklist is shown, not changed', { exact: false }).waitFor();

        // Pieces: the settings are shown, not offered.
        await page.goto(href('pieces'));
        const first = doc.pieces[0].label;
        await page.getByRole('button', { name: new RegExp(`^Piece ${first}, `) }).click();
        await page.getByRole('heading', { name: `Piece ${first}`, level: 2 }).waitFor();
        await expect(page.getByRole('radio', { name: '4 mm foam' }).getAttribute('aria-disabled')).resolves.toBe('true');
        await page.getByText('You follow this build as a client', { exact: false }).waitFor();
        await shot(page, 'pieces-390');

        // Sheets & print: the plan is shown; no stock editing, no new plan or print set.
        await page.goto(href('sheets'));
        await page.getByRole('table', { name: 'Sheets per thickness' }).waitFor();
        await expect(page.getByRole('button', { name: 'Edit stock sheets' }).count()).resolves.toBe(0);
        await expect(page.getByRole('button', { name: 'Make a sheet plan' }).count()).resolves.toBe(0);
        await expect(page.getByRole('button', { name: 'Make print set' }).count()).resolves.toBe(0);
        await shot(page, 'sheets-390');
      } finally {
        await context.close();
      }
    });

    it('sheets & print at 1280 px: stock edit, a sheet plan and a print set from queued to done, download links', async () => {
      const { context, page, errors } = await signedIn('owner', 1280, 800);
      try {
        await page.goto(href('sheets'));
        await page.getByRole('table', { name: 'Sheets per thickness' }).waitFor();
        await shot(page, 'sheets-1280');

        // Stock: a width that is not a number is named by sheet and field; a new price is saved and shown.
        await page.getByRole('button', { name: 'Edit stock sheets' }).click();
        const sixIndex = 3; // the seed lists 2, 4, 6 and 10 mm sheets, so 6 mm is sheet 3
        await page.getByRole('textbox', { name: `Sheet ${sixIndex} width, mm` }).fill('wide');
        await page.getByRole('textbox', { name: `Sheet ${sixIndex} price` }).fill('12,5');
        await page.getByRole('button', { name: 'Save stock' }).click();
        await page.getByText(`Sheet ${sixIndex} width: "wide" is not a number.`).waitFor();
        await page.getByRole('textbox', { name: `Sheet ${sixIndex} width, mm` }).fill('1000');
        const stockSaved = page.waitForResponse((r) => r.url().endsWith('/stock') && r.request().method() === 'PUT');
        await page.getByRole('button', { name: 'Save stock' }).click();
        expect((await stockSaved).status()).toBe(200);
        // en-GB style is not assumed: the reader's locale formats the money, so only the digits are checked.
        await page.getByRole('list', { name: 'Stock sheets' }).getByText(/12\.50/).waitFor();

        // Sheet plan: the request is queued (no worker runs in this test), the page shows it waiting, then the
        // job runs here in the test process, as a worker would, and the page picks up the result by polling.
        const planned = page.waitForResponse((r) => r.url().endsWith('/sheet-plans') && r.request().method() === 'POST');
        await page.getByRole('button', { name: 'Make a sheet plan' }).click();
        const planRes = await planned;
        expect(planRes.status()).toBe(202);
        const { sheetPlan } = (await planRes.json()) as { sheetPlan: { id: string } };
        await page.getByRole('progressbar', { name: 'Waiting to plan the sheets' }).waitFor();
        await runSheetPlanJob({ db, files: localDiskStore(filesDir) }, { sheetPlanId: sheetPlan.id });
        await page.getByRole('progressbar', { name: 'Waiting to plan the sheets' }).waitFor({ state: 'detached', timeout: 15_000 });
        await page.getByRole('table', { name: 'Sheets per thickness' }).waitFor();

        // Print set: PDF (with the bench card) and DXF on Letter paper.
        await page.getByRole('radio', { name: 'Letter page, 8.5 × 11 in' }).click();
        await page.getByRole('checkbox', { name: 'SVG at 1:1 for laser cutters' }).click();
        const made = page.waitForResponse((r) => r.url().endsWith('/print-sets') && r.request().method() === 'POST');
        await page.getByRole('button', { name: 'Make print set' }).click();
        const madeRes = await made;
        expect(madeRes.status()).toBe(202);
        const body = madeRes.request().postDataJSON() as { formats: string[]; page: string; mode: string };
        expect(body).toMatchObject({ page: 'letter', mode: 'tiled' });
        expect([...body.formats].sort()).toEqual(['dxf', 'pdf']);
        const { printSet } = (await madeRes.json()) as { printSet: { id: string } };
        await page.getByRole('progressbar', { name: 'Waiting to make the print set' }).waitFor();
        const result = await runPrintSetJob({ db, files: localDiskStore(filesDir) }, { printSetId: printSet.id });
        const pdfLink = page.getByRole('link', { name: 'Download Print set (PDF)' });
        await pdfLink.waitFor({ timeout: 15_000 });
        await page.getByRole('link', { name: 'Download Bench card (PDF)' }).waitFor();
        await page.getByRole('link', { name: 'Download Pattern (DXF, 1:1)' }).waitFor();
        await shot(page, 'sheets-1280-print-set');
        // The file the link serves is a PDF (ISO 32000-1 §7.5.2: a file starts with the header %PDF-).
        expect(result.status).toBe('done');
        const url = await pdfLink.getAttribute('href');
        const file = await context.request.get(`${base}${url}`);
        expect(file.status()).toBe(200);
        expect((await file.body()).subarray(0, 5).toString('latin1')).toBe('%PDF-');
        await page.goto(href('bench'));
        await page.getByRole('textbox', { name: 'Seam number' }).waitFor();
        await shot(page, 'bench-1280');
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    });

    // Last, since it changes the pattern the other tests read.
    it('pieces at 1280 px: a thickness change re-flattens with progress shown and the board kept, then shows the new figure', async () => {
      const { context, page, errors } = await signedIn('owner', 1280, 800);
      const label = doc.pieces[0].label;
      try {
        await page.goto(href('pieces'));
        const piece = page.getByRole('button', { name: new RegExp(`^Piece ${label}, 6 mm`) });
        await piece.waitFor();
        await expect(page.getByRole('button', { name: /^Piece [A-Z]+, / }).count()).resolves.toBe(doc.pieces.length);
        // Keyboard: Enter and Space pick a focused piece (WAI-ARIA APG button pattern); a click on the picked
        // piece clears the pick, another click picks it again.
        const second = page.getByRole('button', { name: new RegExp(`^Piece ${doc.pieces[1].label}, `) });
        await second.focus();
        await page.keyboard.press('Enter');
        await expect(second.getAttribute('aria-pressed')).resolves.toBe('true');
        await piece.focus();
        await page.keyboard.press('Space');
        await expect(piece.getAttribute('aria-pressed')).resolves.toBe('true');
        await expect(second.getAttribute('aria-pressed')).resolves.toBe('false');
        await piece.click();
        await expect(piece.getAttribute('aria-pressed')).resolves.toBe('false');
        await piece.click();
        await expect(piece.getAttribute('aria-pressed')).resolves.toBe('true');
        await page.getByRole('heading', { name: `Piece ${label}`, level: 2 }).waitFor();
        await shot(page, 'pieces-1280');
        const patched = page.waitForResponse((r) => r.url().endsWith(`/pieces/${label}`) && r.request().method() === 'PATCH');
        await page.getByRole('radio', { name: '4 mm foam' }).click();
        const res = await patched;
        expect(res.status(), await res.text()).toBe(200);
        expect(res.request().postDataJSON()).toEqual({ thicknessMm: 4 });
        // Re-queued (no worker runs here): progress shows and the previous pieces stay on the board meanwhile.
        await page.getByRole('progressbar', { name: /flatten the pieces|Flattening the pieces/ }).waitFor();
        await page.getByText('Showing the pieces as they were until the new ones are ready.').waitFor();
        await expect(page.getByRole('button', { name: /^Piece [A-Z]+, / }).count()).resolves.toBe(doc.pieces.length);
        await shot(page, 'pieces-1280-reflattening');
        const [queued] = await db.select({ id: patterns.id }).from(patterns).where(eq(patterns.buildId, buildId)).orderBy(desc(patterns.createdAt)).limit(1);
        const result = await runPatternJob({ db, files: localDiskStore(filesDir) }, { patternId: queued.id });
        // The finished pattern gives the piece the 4 mm chosen: the board's name for it says so.
        expect(result.status).toBe('done');
        await page.getByRole('button', { name: new RegExp(`^Piece ${label}, 4 mm`) }).waitFor({ timeout: 15_000 });
        await page.getByRole('progressbar').waitFor({ state: 'detached' });
        expect(errors).toEqual([]);
      } finally {
        await context.close();
      }
    });
  },
);

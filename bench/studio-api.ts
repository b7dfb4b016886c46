/**
 * Sets up a build with a processed sculpt through the public API, as a new maker would: sign up, start a shop
 * and a build, upload an OBJ, wait for the processing job. Used by the studio's browser test and its first-render
 * benchmark. The OBJ is generated from the engine's helmet shell (geometry/shapes), so nothing is downloaded.
 */
import { helmetShell, type HelmetShellOptions } from '../geometry/shapes';

/** A signed-in session against `base` (e.g. http://127.0.0.1:8483): its cookie and the ids it made. */
export interface StudioFixture {
  base: string;
  cookie: string;
  email: string;
  password: string;
  shopId: string;
  buildId: string;
  sculptId: string;
  triangles: number;
}

/** OBJ text of the helmet shell with `options` (mm). */
export function helmetObj(options: HelmetShellOptions = {}): { text: string; triangles: number } {
  const m = helmetShell(options);
  const lines: string[] = ['# Sheetsmith studio fixture: helmet shell from geometry/shapes'];
  const P = m.positions;
  for (let i = 0; i < P.length; i += 3) lines.push(`v ${P[i].toFixed(4)} ${P[i + 1].toFixed(4)} ${P[i + 2].toFixed(4)}`);
  const T = m.triangles;
  for (let i = 0; i < T.length; i += 3) lines.push(`f ${T[i] + 1} ${T[i + 1] + 1} ${T[i + 2] + 1}`);
  return { text: lines.join('\n') + '\n', triangles: T.length / 3 };
}

async function call(base: string, cookie: string, method: string, path: string, body?: unknown): Promise<{ status: number; json: any; cookie: string }> {
  const res = await fetch(base + path, {
    method,
    headers: { Accept: 'application/json', ...(body === undefined ? {} : { 'Content-Type': 'application/json' }), ...(cookie ? { Cookie: cookie } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  const set = res.headers.getSetCookie?.() ?? [];
  const newCookie = set.length ? set.map((c) => c.split(';')[0]).join('; ') : cookie;
  let json: unknown = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = text;
  }
  if (res.status >= 400) throw new Error(`${method} ${path} answered ${res.status}: ${text.slice(0, 400)}`);
  return { status: res.status, json, cookie: newCookie };
}

/**
 * Signs up a fresh editor-owner, creates a shop and a build, uploads the helmet OBJ (`options` set its
 * resolution; `targetTriangles` keeps a dense one from being reduced) and waits up to `timeoutMs` for the
 * sculpt to be processed. Throws with the server's answer when a step fails, or with the job's error.
 */
export async function createStudioFixture(
  base: string,
  options: HelmetShellOptions = {},
  timeoutMs = 120_000,
  targetTriangles?: number,
): Promise<StudioFixture> {
  const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
  const email = `studio-${stamp}@example.test`;
  const password = 'foam-and-bevels-2026';
  let r = await call(base, '', 'POST', '/api/auth/signup', { name: 'Studio Tester', email, password });
  let cookie = r.cookie;
  r = await call(base, cookie, 'POST', '/api/shops', { name: `Studio shop ${stamp}` });
  cookie = r.cookie;
  const shopId = String(r.json.shop?.id ?? r.json.id);
  r = await call(base, cookie, 'POST', `/api/shops/${shopId}/builds`, { name: 'Studio helm' });
  const buildId = String(r.json.build?.id ?? r.json.id);
  const obj = helmetObj(options);
  const form = new FormData();
  form.append('units', 'mm');
  form.append('scale', '1');
  if (targetTriangles) form.append('targetTriangles', String(targetTriangles));
  form.append('file', new Blob([obj.text], { type: 'text/plain' }), 'helm.obj');
  const up = await fetch(`${base}/api/shops/${shopId}/builds/${buildId}/sculpts`, { method: 'POST', headers: { Cookie: cookie }, body: form });
  const upText = await up.text();
  if (up.status !== 202) throw new Error(`upload answered ${up.status}: ${upText.slice(0, 400)}`);
  const sculptId = String(JSON.parse(upText).sculpt.id);
  const until = Date.now() + timeoutMs;
  for (;;) {
    const s = await call(base, cookie, 'GET', `/api/shops/${shopId}/builds/${buildId}/sculpts/${sculptId}`);
    const sculpt = s.json.sculpt;
    if (sculpt.status === 'done') return { base, cookie, email, password, shopId, buildId, sculptId, triangles: sculpt.report?.workingTriangles ?? obj.triangles };
    if (sculpt.status === 'failed') throw new Error(`the sculpt failed to process: ${sculpt.error}`);
    if (Date.now() > until) throw new Error(`the sculpt was not processed within ${timeoutMs} ms (status ${sculpt.status}, ${sculpt.progress}%)`);
    await new Promise((res) => setTimeout(res, 500));
  }
}

/** GET the sculpt's seam set through the API (for checks after the browser saved). */
export async function fetchSeams(f: StudioFixture): Promise<{ revision: number; seams: { id: string; picks: number[]; path: number[]; source: string }[] }> {
  const r = await call(f.base, f.cookie, 'GET', `/api/shops/${f.shopId}/builds/${f.buildId}/sculpts/${f.sculptId}/seams`);
  return r.json.seams;
}

/** PUT the sculpt's seam set through the API as another editor would (for the studio's conflict check). */
export async function replaceSeams(f: StudioFixture, baseRevision: number, seams: { id: string; picks: number[]; path: number[]; source: string }[]): Promise<number> {
  const r = await call(f.base, f.cookie, 'PUT', `/api/shops/${f.shopId}/builds/${f.buildId}/sculpts/${f.sculptId}/seams`, {
    baseRevision,
    seams,
    symmetry: null,
    stretchBudgetPct: 3,
  });
  return r.json.seams.revision;
}

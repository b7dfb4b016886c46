/**
 * Sculpts through the API against the real PostgreSQL test database: upload (OBJ, STL, PLY), the processing
 * job run directly (progress, result, errors with line numbers), content and size checks, file-name tricks,
 * roles, settings changes, the working mesh download, and seams (save, conflicts, validation, carry-over).
 * The job queue is a recording sender, so nothing runs behind the test's back.
 */
import { randomUUID } from 'node:crypto';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { and, eq, inArray } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog } from '../../db/schema-core';
import { sculpts } from '../../db/schema-sculpts';
import { decodeWorkingMesh } from '../../geometry/io/working-mesh';
import { headSection } from '../../geometry/mesh/wearer-scale';
import { icoSphere, transformMesh } from '../../geometry/shapes';
import type { TriMesh } from '../../geometry/mesh/tri-mesh';
import type { JobSender } from '../../server/jobs/job-sender';
import { processSculpt } from '../../server/sculpts/process-sculpt';
import { failStaleSculpts, STALE_SCULPT_MINUTES } from '../../server/sculpts/sculpt-job';
import type { FileStore } from '../../server/storage/file-store';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { writeBinaryStl, writeObj, writePly } from '../geometry/io/model-writers';
import { insertBuild, makeShopFixture, makeTestApp, type ShopFixture, type TestContext } from './helpers';

/** A JobSender that records what was queued. */
function recordingSender(): JobSender & { sent: Array<{ name: string; data: Record<string, unknown> }> } {
  const sent: Array<{ name: string; data: Record<string, unknown> }> = [];
  return { sent, send: async (name, data) => (sent.push({ name, data }), randomUUID()) };
}

/** The file store, with a hook called when the working mesh is written (to look at the row mid-job). */
function watchedStore(dir: string): FileStore & { onMeshPut: ((key: string) => Promise<void>) | null } {
  const inner = localDiskStore(dir);
  const store = {
    onMeshPut: null as ((key: string) => Promise<void>) | null,
    put: async (key: string, bytes: Uint8Array) => {
      if (key.endsWith('/mesh.bin') && store.onMeshPut) await store.onMeshPut(key);
      return inner.put(key, bytes);
    },
    open: inner.open,
    remove: inner.remove,
    removePrefix: inner.removePrefix,
  };
  return store;
}

let ctx: TestContext;
let fx: ShopFixture;
let jobs: ReturnType<typeof recordingSender>;
let files: ReturnType<typeof watchedStore>;
let buildId: string;

beforeAll(async () => {
  jobs = recordingSender();
  files = watchedStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-sculpts-')));
  ctx = await makeTestApp({ jobs, files });
  fx = await makeShopFixture(ctx);
  buildId = await insertBuild(ctx.db, fx.shopId, 'Wasp helm');
});
afterAll(async () => {
  await ctx.close();
});

const base = (b = buildId) => `/api/shops/${fx.shopId}/builds/${b}/sculpts`;
const objBytes = (mesh: TriMesh) => Buffer.from(writeObj(mesh));

function upload(bytes: Buffer | Uint8Array, filename: string, fields: Record<string, string> = {}, cookie = fx.people.editor.cookie, url = base()) {
  let req = request(ctx.app).post(url).set('Cookie', cookie);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', Buffer.from(bytes), { filename, contentType: 'application/octet-stream' });
}

/** Collects a binary response body (supertest parses only text and JSON). */
function binary(res: unknown, done: (err: Error | null, body: Buffer) => void): void {
  const stream = res as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}

async function uploadAndProcess(bytes: Buffer | Uint8Array, filename: string, fields: Record<string, string> = {}, b = buildId) {
  const res = await upload(bytes, filename, fields, fx.people.editor.cookie, base(b));
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  await processSculpt({ db: ctx.db, files, jobs }, res.body.sculpt.id);
  const got = await request(ctx.app).get(`${base(b)}/${res.body.sculpt.id}`).set('Cookie', fx.people.viewer.cookie);
  return got.body.sculpt;
}

async function downloadMesh(meshUrl: string) {
  const res = await request(ctx.app).get(meshUrl).set('Cookie', fx.people.viewer.cookie).buffer(true).parse(binary);
  expect(res.status).toBe(200);
  return { res, mesh: decodeWorkingMesh(new Uint8Array(res.body as Buffer)) };
}

/** A shortest edge path from `from` to `to` by breadth-first search (the test's own, independent of the server). */
function edgePath(mesh: { triangles: Uint32Array }, vertexCount: number, from: number, to: number): number[] {
  const adj: number[][] = Array.from({ length: vertexCount }, () => []);
  const T = mesh.triangles;
  for (let f = 0; f < T.length; f += 3) {
    for (let i = 0; i < 3; i++) {
      adj[T[f + i]].push(T[f + ((i + 1) % 3)]);
      adj[T[f + ((i + 1) % 3)]].push(T[f + i]);
    }
  }
  const prev = new Int32Array(vertexCount).fill(-1);
  prev[from] = from;
  const queue = [from];
  while (queue.length > 0) {
    const v = queue.shift()!;
    if (v === to) break;
    for (const w of adj[v]) if (prev[w] < 0) ((prev[w] = v), queue.push(w));
  }
  const out = [to];
  while (out[0] !== from) out.unshift(prev[out[0]]);
  return out;
}

describe('upload and processing', () => {
  it('takes an OBJ as version 1, queues sculpt-process, records an audit entry, and processes it through its stages', async () => {
    const sphere = icoSphere(80, 2);
    const sent = jobs.sent.length;
    const res = await upload(objBytes(sphere), 'wasp-helm.obj', { units: 'mm' });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    const view = res.body.sculpt;
    expect(view).toMatchObject({ buildId, version: 1, fileName: 'wasp-helm.obj', format: 'obj', units: 'mm', scale: 1, status: 'queued', progress: 0, meshUrl: null, report: null, targetTriangles: 200_000 });
    expect(jobs.sent.slice(sent)).toEqual([{ name: 'sculpt-process', data: { sculptId: view.id } }]);
    const audit = await ctx.db.select().from(auditLog).where(and(eq(auditLog.action, 'sculpt.upload'), eq(auditLog.target, `sculpt:${view.id}`)));
    expect(audit).toHaveLength(1);

    const seen: Array<Record<string, unknown>> = [];
    files.onMeshPut = async () => {
      const [row] = await ctx.db.select().from(sculpts).where(eq(sculpts.id, view.id));
      seen.push({ status: row.status, progress: row.progress, stage: row.stage });
    };
    await processSculpt({ db: ctx.db, files }, view.id);
    files.onMeshPut = null;
    expect(seen).toEqual([{ status: 'running', progress: 90, stage: 'saving' }]);

    const done = (await request(ctx.app).get(`${base()}/${view.id}`).set('Cookie', fx.people.viewer.cookie)).body.sculpt;
    expect(done).toMatchObject({ status: 'done', progress: 100, stage: 'done', error: null });
    // Icosphere after n = 2 subdivisions: F = 20·4ⁿ = 320 faces, V = 10·4ⁿ + 2 = 162 (Euler: V − E + F = 2).
    expect(done.report).toMatchObject({ sourceTriangles: 320, sourceVertices: 162, workingTriangles: 320, workingVertices: 162, droppedFaces: 0, nonManifoldEdges: 0 });
    expect(done.meshUrl).toBe(`${base()}/${view.id}/mesh`);
    const { res: meshRes, mesh } = await downloadMesh(done.meshUrl);
    expect(meshRes.headers['content-type']).toBe('application/octet-stream');
    expect(mesh.positions.length / 3).toBe(162);
    // Every vertex of an icosphere lies on the sphere: |p| = r (to float32 precision).
    for (let v = 0; v < 162; v++) expect(Math.hypot(mesh.positions[3 * v], mesh.positions[3 * v + 1], mesh.positions[3 * v + 2])).toBeCloseTo(80, 4);
    const etag = meshRes.headers.etag as string;
    expect(etag).toContain(view.id);
    // RFC 9110 §13.1.2: a matching If-None-Match on GET answers 304 Not Modified.
    const again = await request(ctx.app).get(done.meshUrl).set('Cookie', fx.people.viewer.cookie).set('If-None-Match', etag);
    expect(again.status).toBe(304);
  });

  it('reads a binary STL in centimetres (1 cm = 10 mm, SI) and a binary PLY, numbering versions per build', async () => {
    const b = await insertBuild(ctx.db, fx.shopId, 'Gauntlet');
    const box = icoSphere(3, 1);
    const stl = await uploadAndProcess(writeBinaryStl(box), 'gauntlet.stl', { units: 'cm' }, b);
    expect(stl).toMatchObject({ version: 1, format: 'stl', status: 'done', units: 'cm' });
    // STL repeats each corner; welding brings back the 42 vertices of a once-subdivided icosphere (10·4 + 2).
    expect(stl.report.workingVertices).toBe(42);
    const { mesh } = await downloadMesh(stl.meshUrl);
    expect(Math.hypot(mesh.positions[0], mesh.positions[1], mesh.positions[2])).toBeCloseTo(30, 4);
    const ply = await uploadAndProcess(writePly(box, 'binary_little_endian'), 'gauntlet.ply', {}, b);
    expect(ply).toMatchObject({ version: 2, format: 'ply', status: 'done' });
    const list = await request(ctx.app).get(base(b)).set('Cookie', fx.people.viewer.cookie);
    expect(list.body.sculpts.map((s: { version: number }) => s.version)).toEqual([2, 1]);
  });

  it('records a bad model as failed with the file line number, and leaves it failed', async () => {
    const bad = readFileSync(path.join(__dirname, '../fixtures/meshes/bad-index.obj'));
    const sculpt = await uploadAndProcess(bad, 'bad-index.obj');
    expect(sculpt.status).toBe('failed');
    // The fixture's fifth line is "f 1 2 9" with only three vertices defined.
    expect(sculpt.error).toMatch(/^bad-index\.obj: .*line 5/);
    expect(sculpt.meshUrl).toBeNull();
    await processSculpt({ db: ctx.db, files }, sculpt.id);
    const again = await request(ctx.app).get(`${base()}/${sculpt.id}`).set('Cookie', fx.people.viewer.cookie);
    expect(again.body.sculpt.status).toBe('failed');
  });

  it('reduces a mesh above the target triangle count and keeps it closed', async () => {
    const b = await insertBuild(ctx.db, fx.shopId, 'Dense scan');
    // 20·4⁴ = 5120 triangles in, asked for 1000.
    const sculpt = await uploadAndProcess(objBytes(icoSphere(70, 4)), 'dense.obj', { targetTriangles: '1000' }, b);
    expect(sculpt).toMatchObject({ status: 'done', targetTriangles: 1000 });
    expect(sculpt.report.sourceTriangles).toBe(5120);
    expect(sculpt.report.workingTriangles).toBeLessThanOrEqual(1000);
    expect(sculpt.report.workingTriangles).toBeGreaterThan(500);
    const { mesh } = await downloadMesh(sculpt.meshUrl);
    // A closed triangulated sphere: V − E + F = 2 with E = 3F/2 (Euler), so V = F/2 + 2.
    expect(mesh.positions.length / 3).toBe(mesh.triangles.length / 6 + 2);
  });

  it('scales to a head circumference so that the working mesh measures it round its middle', async () => {
    const b = await insertBuild(ctx.db, fx.shopId, 'Round helm');
    const sculpt = await uploadAndProcess(objBytes(icoSphere(90, 3)), 'round.obj', { headCircumferenceMm: '580' }, b);
    expect(sculpt.status).toBe('done');
    expect(sculpt.wearer).toEqual({ headCircumferenceMm: 580, headHeightMm: null });
    expect(sculpt.scale).not.toBe(1);
    const { mesh } = await downloadMesh(sculpt.meshUrl);
    const section = headSection(mesh.positions, mesh.triangles, { upAxis: 1, heightFraction: 0.5 })!;
    expect(section.circumferenceMm).toBeCloseTo(580, 1);
    expect(sculpt.report.warnings.join(' ')).toMatch(/scaled by .* to the wearer/);
  });
  it('fails a sculpt left running past every attempt\'s expiry, and leaves a recent one running', async () => {
    const old = (await upload(objBytes(icoSphere(10, 0)), 'lost.obj')).body.sculpt.id;
    const recent = (await upload(objBytes(icoSphere(10, 0)), 'busy.obj')).body.sculpt.id;
    await ctx.db.update(sculpts).set({ status: 'running', startedAt: new Date(Date.now() - (STALE_SCULPT_MINUTES + 1) * 60_000) }).where(eq(sculpts.id, old));
    await ctx.db.update(sculpts).set({ status: 'running', startedAt: new Date() }).where(eq(sculpts.id, recent));
    await failStaleSculpts({ db: ctx.db, files });
    const rows = await ctx.db.select().from(sculpts).where(inArray(sculpts.id, [old, recent]));
    const byId = Object.fromEntries(rows.map((r) => [r.id, r]));
    expect(byId[old]).toMatchObject({ status: 'failed' });
    expect(byId[old].error).toMatch(/did not finish within \d+ minutes/);
    expect(byId[recent].status).toBe('running');
    await ctx.db.update(sculpts).set({ status: 'failed' }).where(eq(sculpts.id, recent));
  });
});

describe('upload checks', () => {
  it('refuses a PNG image renamed .obj, saying what it is (PNG signature, ISO/IEC 15948 §5.2)', async () => {
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);
    const res = await upload(png, 'helm.obj');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('UNSUPPORTED_TYPE');
    expect(res.body.error.message).toContain('PNG image');
    expect(res.body.error.message).toContain('helm.obj');
  });

  it('refuses binary bytes in a file named .obj and content that is no model', async () => {
    const res = await upload(Buffer.from([0x76, 0x20, 0x00, 0x01, 0x02, 0x03]), 'odd.obj');
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/binary bytes/);
    const txt = await upload(Buffer.from('%%%% not a model'), 'notes.txt');
    expect(txt.status).toBe(415);
  });

  it('answers 413 naming the limit when the file is too large', async () => {
    const small = await makeTestApp({ jobs, files, sessionSecret: ctx.secret, env: { SCULPT_MAX_UPLOAD_BYTES: '2000' } });
    try {
      const res = await request(small.app).post(base()).set('Cookie', fx.people.editor.cookie).attach('file', objBytes(icoSphere(10, 2)), 'big.obj');
      expect(res.status).toBe(413);
      expect(res.body.error.code).toBe('FILE_TOO_LARGE');
      expect(res.body.error.message).toContain('larger than the 2000-byte limit');
    } finally {
      await small.close();
    }
  });

  it('keeps only the last part of a file name with a path and stores the file under a generated key', async () => {
    const res = await upload(objBytes(icoSphere(10, 0)), '../../../etc/cron.d/helm.obj');
    expect(res.status).toBe(202);
    expect(res.body.sculpt.fileName).toBe('helm.obj');
    const [row] = await ctx.db.select().from(sculpts).where(eq(sculpts.id, res.body.sculpt.id));
    expect(row.sourceKey).toBe(`sculpts/${row.id}/source.obj`);
    const win = await upload(objBytes(icoSphere(10, 0)), 'C:\\Users\\maker\\helm2.obj');
    expect(win.body.sculpt.fileName).toBe('helm2.obj');
    const dots = await upload(objBytes(icoSphere(10, 0)), '..');
    expect(dots.status).toBe(400);
    expect(dots.body.error.code).toBe('BAD_FILE_NAME');
  });

  it('validates the form fields with a message per field', async () => {
    const res = await upload(objBytes(icoSphere(10, 0)), 'x.obj', { units: 'ft', scale: '0', headCircumferenceMm: '90' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.units).toMatch(/mm, cm, m, in/);
    expect(res.body.error.fields.scale).toMatch(/greater than 0/);
    expect(res.body.error.fields.headCircumferenceMm).toMatch(/at least 300 mm/);
    const both = await upload(objBytes(icoSphere(10, 0)), 'x.obj', { scale: '2', headHeightMm: '230' });
    expect(both.body.error.fields.scale).toMatch(/not both/);
    const none = await request(ctx.app).post(base()).set('Cookie', fx.people.editor.cookie).send({ units: 'mm' });
    expect(none.status).toBe(400);
    expect(none.body.error.code).toBe('NO_FILE');
  });

  it('answers 503 and fails the row when there is no job queue', async () => {
    const noQueue = await makeTestApp({ files, sessionSecret: ctx.secret });
    try {
      const res = await request(noQueue.app).post(base()).set('Cookie', fx.people.editor.cookie).attach('file', objBytes(icoSphere(10, 0)), 'q.obj');
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('QUEUE_UNAVAILABLE');
      const list = await request(ctx.app).get(base()).set('Cookie', fx.people.viewer.cookie);
      expect(list.body.sculpts[0]).toMatchObject({ status: 'failed', fileName: 'q.obj' });
    } finally {
      await noQueue.close();
    }
  });
});

describe('roles', () => {
  it('lets a viewer read but not upload, and keeps other shops out', async () => {
    const viewer = await upload(objBytes(icoSphere(10, 0)), 'v.obj', {}, fx.people.viewer.cookie);
    expect(viewer.status).toBe(403);
    const other = await request(ctx.app).get(base()).set('Cookie', fx.people.otherOwner.cookie);
    expect(other.status).toBe(403);
    const otherUpload = await upload(objBytes(icoSphere(10, 0)), 'o.obj', {}, fx.people.otherOwner.cookie);
    expect(otherUpload.status).toBe(403);
    const anon = await request(ctx.app).get(base());
    expect(anon.status).toBe(401);
    const foreignBuild = await insertBuild(ctx.db, fx.otherShopId, 'Not yours');
    const foreign = await upload(objBytes(icoSphere(10, 0)), 'f.obj', {}, fx.people.editor.cookie, base(foreignBuild));
    expect(foreign.status).toBe(404);
    const unknown = await request(ctx.app).get(`${base()}/${randomUUID()}`).set('Cookie', fx.people.viewer.cookie);
    expect(unknown.status).toBe(404);
  });
});

describe('seams', () => {
  let sculptId: string;
  let V: number;
  let path1: number[];
  let b: string;
  const sphere = icoSphere(60, 2);

  beforeAll(async () => {
    b = await insertBuild(ctx.db, fx.shopId, 'Seamed helm');
    const s = await uploadAndProcess(objBytes(sphere), 'seamed.obj', {}, b);
    sculptId = s.id;
    V = s.report.workingVertices;
    const { mesh } = await downloadMesh(s.meshUrl);
    path1 = edgePath(mesh, V, 0, 3);
  });
  const seamsUrl = () => `${base(b)}/${sculptId}/seams`;

  it('starts empty at revision 0, saves revision 1, queues a pattern, and refuses a stale save with the current set', async () => {
    const empty = await request(ctx.app).get(seamsUrl()).set('Cookie', fx.people.viewer.cookie);
    expect(empty.body.seams).toMatchObject({ sculptId, revision: 0, seams: [], symmetry: null, stretchBudgetPct: 3 });
    const sent = jobs.sent.length;
    const body = { baseRevision: 0, seams: [{ id: 's1', picks: [path1[0], path1[path1.length - 1]], path: path1, source: 'picked' }], symmetry: { normal: [1, 0, 0], offsetMm: 0 }, stretchBudgetPct: 4 };
    const saved = await request(ctx.app).put(seamsUrl()).set('Cookie', fx.people.editor.cookie).send(body);
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.body.seams).toMatchObject({ revision: 1, stretchBudgetPct: 4, updatedBy: fx.people.editor.id });
    expect(jobs.sent.slice(sent).map((j) => j.name)).toEqual(['pattern-build']);
    const stale = await request(ctx.app).put(seamsUrl()).set('Cookie', fx.people.owner.cookie).send({ ...body, seams: [] });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('SEAMS_CHANGED');
    expect(stale.body.current.revision).toBe(1);
    expect(stale.body.current.seams[0].path).toEqual(path1);
    const viewer = await request(ctx.app).put(seamsUrl()).set('Cookie', fx.people.viewer.cookie).send({ ...body, baseRevision: 1 });
    expect(viewer.status).toBe(403);
  });

  it('refuses a vertex id past the mesh and a step that is not a mesh edge, naming the seam and the ids', async () => {
    const current = (await request(ctx.app).get(seamsUrl()).set('Cookie', fx.people.viewer.cookie)).body.seams;
    const send = (seams: unknown[]) => request(ctx.app).put(seamsUrl()).set('Cookie', fx.people.editor.cookie).send({ baseRevision: current.revision, seams, symmetry: null, stretchBudgetPct: 3 });
    const outOfRange = await send([{ id: 'ok', picks: [path1[0], path1[1]], path: path1.slice(0, 2), source: 'picked' }, { id: 'far', picks: [0, V + 5], path: [0, V + 5], source: 'picked' }]);
    expect(outOfRange.status).toBe(400);
    expect(outOfRange.body.error.fields['seams.1.picks.1']).toContain(`seam "far" (number 2): picked vertex ${V + 5}`);
    expect(outOfRange.body.error.fields['seams.1.picks.1']).toContain(`has ${V}`);
    const a = path1[0];
    const far = edgePath({ triangles: sphere.triangles }, V, a, 1).length > 2 ? 1 : 2;
    const jump = await send([{ id: 'jump', picks: [a, far], path: [a, far], source: 'picked' }]);
    expect(jump.status).toBe(400);
    expect(jump.body.error.fields['seams.0.path.1']).toContain(`${a} and ${far}`);
    expect(jump.body.error.fields['seams.0.path.1']).toContain('not joined by a mesh edge');
    const dup = await send([{ id: 'x', picks: [0, 1], path: [0, 1], source: 'picked' }, { id: 'x', picks: [0, 1], path: [0, 1], source: 'picked' }]);
    expect(dup.body.error.fields['seams.1.id']).toContain('used twice');
  });

  it('carries every seam to a translated copy uploaded as the next version', async () => {
    const moved = transformMesh(sphere, { translation: [37, -12, 5] });
    const v2 = await uploadAndProcess(objBytes(moved), 'seamed-v2.obj', {}, b);
    expect(v2.version).toBe(2);
    const seams = (await request(ctx.app).get(`${base(b)}/${v2.id}/seams`).set('Cookie', fx.people.viewer.cookie)).body.seams;
    expect(seams.seams).toHaveLength(1);
    expect(seams.seams[0]).toMatchObject({ id: 's1', source: 'carried', path: path1 });
    expect(v2.report.warnings.join(' ')).toContain(`1 of 1 seams from version 1 carried over whole (${path1.length - 1} of ${path1.length - 1} seam edges kept)`);
  });

  it('carries only the unchanged part of a seam to an edited model', async () => {
    // Version 2's placement with the seam's last vertex pushed outward: the seam's last edge no longer matches.
    const edited = icoSphere(60, 2);
    const end = path1[path1.length - 1];
    for (let k = 0; k < 3; k++) edited.positions[3 * end + k] *= 1.2;
    const v3 = await uploadAndProcess(objBytes(transformMesh(edited, { translation: [37, -12, 5] })), 'seamed-v3.obj', {}, b);
    const seams = (await request(ctx.app).get(`${base(b)}/${v3.id}/seams`).set('Cookie', fx.people.viewer.cookie)).body.seams;
    const kept = seams.seams.reduce((n: number, s: { path: number[] }) => n + s.path.length - 1, 0);
    expect(kept).toBe(path1.length - 2);
    expect(seams.seams[0].path).toEqual(path1.slice(0, -1));
    expect(v3.report.warnings.join(' ')).toMatch(/seams from version 2 carried over whole, 1 in parts/);
  });

  it('keeps the seams when the units change and the mesh is processed again', async () => {
    const before = (await request(ctx.app).get(seamsUrl()).set('Cookie', fx.people.viewer.cookie)).body.seams;
    const patched = await request(ctx.app).patch(`${base(b)}/${sculptId}`).set('Cookie', fx.people.editor.cookie).send({ units: 'cm' });
    expect(patched.status, JSON.stringify(patched.body)).toBe(202);
    expect(patched.body.sculpt).toMatchObject({ status: 'queued', units: 'cm' });
    const busy = await request(ctx.app).patch(`${base(b)}/${sculptId}`).set('Cookie', fx.people.editor.cookie).send({ units: 'm' });
    expect(busy.status).toBe(409);
    await processSculpt({ db: ctx.db, files }, sculptId);
    const after = (await request(ctx.app).get(`${base(b)}/${sculptId}`).set('Cookie', fx.people.viewer.cookie)).body.sculpt;
    expect(after.status).toBe('done');
    // 1 cm = 10 mm: the sphere's 120 mm extent becomes about 1200 mm.
    expect(Math.max(...after.report.sizeMm)).toBeCloseTo(1200, 0);
    const seams = (await request(ctx.app).get(seamsUrl()).set('Cookie', fx.people.viewer.cookie)).body.seams;
    expect(seams.seams.map((s: { path: number[] }) => s.path)).toEqual(before.seams.map((s: { path: number[] }) => s.path));
    expect(seams.revision).toBe(before.revision + 1);
  });
});

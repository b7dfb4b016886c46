/**
 * Security checks across uploads, stored files and sessions that complement tests/server/sculpts.test.ts and
 * tests/server/auth.test.ts (which hold the single-case checks):
 * - whatever a client calls its file, the only things written are `sculpts/<uuid>/source.<format>` under the
 *   file store's root (nothing outside it, no client-chosen name), and a name that is a path trick is either
 *   cut to its last part or refused with a message;
 * - the type comes from the content: a model named .png is read as a model, an image named .obj is refused;
 * - the session cookie is Secure behind a TLS-terminating proxy on loopback (X-Forwarded-Proto with
 *   TRUST_PROXY) and a spoofed header from an untrusted peer does not make it so;
 * - password hashes are argon2id in PHC string format.
 */
import { randomUUID } from 'node:crypto';
import { mkdtempSync, readdirSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { users } from '../../db/schema-core';
import type { JobSender } from '../../server/jobs/job-sender';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { insertBuild, makeShopFixture, makeTestApp, setCookies, uniqueEmail, type ShopFixture, type TestContext } from './helpers';

/** A unit cube as an OBJ (8 vertices, 12 triangles), written here so the test reads as plain text. */
const CUBE_OBJ = [
  'v 0 0 0', 'v 10 0 0', 'v 10 10 0', 'v 0 10 0', 'v 0 0 10', 'v 10 0 10', 'v 10 10 10', 'v 0 10 10',
  'f 1 3 2', 'f 1 4 3', 'f 5 6 7', 'f 5 7 8', 'f 1 2 6', 'f 1 6 5', 'f 2 3 7', 'f 2 7 6', 'f 3 4 8', 'f 3 8 7', 'f 4 1 5', 'f 4 5 8',
].join('\n');
/** The 8-byte PNG signature (ISO/IEC 15948 §5.2) followed by filler. */
const PNG_BYTES = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(64, 1)]);

let ctx: TestContext;
let fx: ShopFixture;
let filesRoot: string;
let buildId: string;
const sent: string[] = [];
const jobs: JobSender = {
  async send(name) {
    sent.push(name);
    return randomUUID();
  },
};

beforeAll(async () => {
  filesRoot = mkdtempSync(path.join(tmpdir(), 'sheetsmith-upload-sec-'));
  ctx = await makeTestApp({ files: localDiskStore(filesRoot), jobs, env: { SCULPT_MAX_UPLOAD_BYTES: '4096' } });
  fx = await makeShopFixture(ctx);
  buildId = await insertBuild(ctx.db, fx.shopId, 'Upload security');
});
afterAll(async () => {
  await ctx?.close();
});

const upload = (bytes: Buffer | string, fileName: string) =>
  request(ctx.app)
    .post(`/api/shops/${fx.shopId}/builds/${buildId}/sculpts`)
    .set('Cookie', fx.people.editor.cookie)
    .field('units', 'mm')
    .attach('file', Buffer.isBuffer(bytes) ? bytes : Buffer.from(bytes), { filename: fileName, contentType: 'application/octet-stream' });

/** Every file under `dir`, as slash-separated paths relative to it. */
function filesUnder(dir: string, prefix = ''): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? filesUnder(full, `${prefix}${name}/`) : [`${prefix}${name}`];
  });
}

describe('uploaded file names and where files land', () => {
  const tricks: Array<[string, 'cut' | 'refused']> = [
    ['../../../../tmp/escape.obj', 'cut'],
    ['..\\..\\windows\\escape.obj', 'cut'],
    ['/etc/cron.d/escape.obj', 'cut'],
    ['%2e%2e%2f%2e%2e%2fescape.obj', 'cut'],
    ['sculpts/../../escape.obj', 'cut'],
    ['\u202Ejbo.png', 'cut'],
    ['helm\u0000.obj', 'refused'],
    ['../', 'refused'],
    ['..', 'refused'],
  ];

  it.each(tricks)('name %j is %s, and only generated keys are written', async (name, outcome) => {
    const res = await upload(CUBE_OBJ, name);
    if (outcome === 'refused') {
      expect(res.status).toBe(400);
      // A NUL inside the multipart header is refused by the form parser itself (BAD_UPLOAD), a name with no
      // name part by the name check (BAD_FILE_NAME); either way a 400 that says what is wrong.
      expect(['BAD_FILE_NAME', 'BAD_UPLOAD']).toContain(res.body.error.code);
      expect(res.body.error.message, res.body.error.message).toMatch(/file name|upload/i);
    } else {
      expect(res.status, JSON.stringify(res.body)).toBe(202);
      // The name kept for display is only the last part, with no separators left in it.
      expect(res.body.sculpt.fileName).not.toMatch(/[/\\]/);
    }
    // Nothing but sculpts/<uuid>/source.obj under the store root, whatever the name said.
    for (const f of filesUnder(filesRoot)) expect(f).toMatch(/^sculpts\/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\/source\.obj$/);
  });

  it('wrote nothing outside the store root for any of those names', () => {
    expect(readdirSync(tmpdir()).filter((n) => n === 'escape.obj')).toEqual([]);
    expect(readdirSync(path.dirname(filesRoot)).filter((n) => n.includes('escape'))).toEqual([]);
  });
});

describe('the type comes from the content, not the name', () => {
  it('reads a model named .png as an OBJ and refuses a PNG named .obj with what it really is', async () => {
    const model = await upload(CUBE_OBJ, 'helm.png');
    expect(model.status, JSON.stringify(model.body)).toBe(202);
    expect(model.body.sculpt.format).toBe('obj');
    const image = await upload(PNG_BYTES, 'helm.obj');
    expect(image.status).toBe(415);
    expect(image.body.error).toMatchObject({ code: 'UNSUPPORTED_TYPE' });
    expect(image.body.error.message).toContain('is a PNG image, not a 3D model');
  });

  it('refuses a file over the configured size (4096 bytes here) with 413 before it reaches the store', async () => {
    const before = filesUnder(filesRoot).length;
    const big = `${CUBE_OBJ}\n${'# padding line for the size limit\n'.repeat(200)}`;
    const res = await upload(big, 'big.obj');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('FILE_TOO_LARGE');
    expect(filesUnder(filesRoot).length).toBe(before);
  });
});

describe('session cookies behind a proxy and stored hashes', () => {
  const signUp = (app: TestContext['app'], proto?: string) => {
    const req = request(app).post('/api/auth/signup');
    return (proto ? req.set('X-Forwarded-Proto', proto) : req).send({ name: 'Proxy test', email: uniqueEmail('proxy'), password: 'long-enough-pw' });
  };
  const sessionLine = (headers: Record<string, unknown>) => setCookies(headers).find((c) => c.startsWith('ss_session=')) ?? '';

  it('is Secure when a trusted proxy on loopback says the request came over https (RFC 6265 §4.1.2.5; COOKIE_SECURE=auto, TRUST_PROXY=loopback)', async () => {
    const res = await signUp(ctx.app, 'https');
    expect(res.status).toBe(201);
    expect(sessionLine(res.headers)).toMatch(/; Secure/i);
    expect(sessionLine(res.headers)).toMatch(/; HttpOnly/i);
    expect(sessionLine(res.headers)).toMatch(/; SameSite=Lax/i);
    const plain = await signUp(ctx.app);
    expect(sessionLine(plain.headers)).not.toMatch(/; Secure/i);
  });

  it('ignores X-Forwarded-Proto when no proxy is trusted (TRUST_PROXY=false), so a client cannot claim https', async () => {
    const untrusting = await makeTestApp({ env: { TRUST_PROXY: 'false' } });
    try {
      const res = await signUp(untrusting.app, 'https');
      expect(res.status).toBe(201);
      expect(sessionLine(res.headers)).not.toMatch(/; Secure/i);
    } finally {
      await untrusting.close();
    }
  });

  it('stores passwords as argon2id PHC strings (RFC 9106 names argon2id the recommended variant)', async () => {
    const email = uniqueEmail('phc');
    await request(ctx.app).post('/api/auth/signup').send({ name: 'Hash test', email, password: 'long-enough-pw' }).expect(201);
    const [row] = await ctx.db.select({ hash: users.passwordHash }).from(users).where(eq(users.email, email));
    // PHC string format: $argon2id$v=19$m=<KiB>,t=<passes>,p=<lanes>$<salt b64>$<hash b64>.
    expect(row.hash).toMatch(/^\$argon2id\$v=19\$m=\d+,t=\d+,p=\d+\$[A-Za-z0-9+/]+\$[A-Za-z0-9+/]+$/);
    expect(row.hash).not.toContain('long-enough-pw');
  });
});

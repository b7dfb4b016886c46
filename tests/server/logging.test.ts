import { Writable } from 'node:stream';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLogger } from '../../server/logger';
import { FIXTURE_PASSWORD, insertPerson, makeTestApp, setCookies, type TestContext } from './helpers';

const lines: string[] = [];
const sink = new Writable({
  write(chunk, _enc, done) {
    lines.push(...String(chunk).split('\n').filter(Boolean));
    done();
  },
});

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp({ logger: createLogger('info', 'test', sink) });
});
afterAll(async () => {
  await ctx.close();
});

describe('request logs', () => {
  it('write one JSON line per request with method, path and status, and never a password or session token (OWASP Logging Cheat Sheet: data to exclude)', async () => {
    const person = await insertPerson(ctx.db, 'logged');
    const res = await request(ctx.app).post('/api/auth/signin').send({ email: person.email, password: FIXTURE_PASSWORD });
    const cookie = setCookies(res.headers)[0].split(';')[0];
    const token = cookie.split('=')[1];
    await request(ctx.app).get('/api/me').set('Cookie', cookie).expect(200);
    await request(ctx.app).get('/api/health').expect(200);

    const entries = lines.map((l) => JSON.parse(l) as { req?: { method: string; url: string }; res?: { statusCode: number } });
    const requests = entries.filter((e) => e.req && e.res).map((e) => `${e.req!.method} ${e.req!.url} ${e.res!.statusCode}`);
    expect(requests).toEqual(['POST /api/auth/signin 200', 'GET /api/me 200']);
    const all = lines.join('\n');
    expect(all).not.toContain(token);
    expect(all).not.toContain(FIXTURE_PASSWORD);
    expect(all).not.toMatch(/set-cookie/i);
  });
});

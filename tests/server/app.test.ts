import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { createDb, createPool } from '../../db/client';
import { createApp } from '../../server/app';
import { AppError, errorHandler } from '../../server/errors';
import { parseEnv } from '../../server/env';
import { createLogger } from '../../server/logger';
import { makeTestApp, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(async () => {
  await ctx.close();
});

describe('health', () => {
  it('reports the database up', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', db: 'up' });
    expect(res.headers['cache-control']).toBe('no-store');
  });

  it('answers 503 with db "down" when PostgreSQL cannot be reached, instead of failing', async () => {
    // Port 9 (discard) on loopback: nothing listens there, so connections are refused at once.
    const pool = createPool('postgres://postgres@127.0.0.1:9/none', 1);
    const app = createApp({ env: parseEnv({ NODE_ENV: 'test' }), pool, db: createDb(pool), sessionSecret: 'x'.repeat(40), logger: createLogger('silent', 't') });
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(503);
    expect(res.body).toEqual({ status: 'degraded', db: 'down' });
    await pool.end();
  });
});

describe('error shape', () => {
  it('answers unknown API routes with 404 JSON in the error shape', async () => {
    for (const [method, url] of [['get', '/api/no-such-thing'], ['post', '/api/shops/x/unknown'], ['delete', '/api']] as const) {
      const res = await request(ctx.app)[method](url);
      expect(res.status, url).toBe(404);
      expect(res.headers['content-type']).toMatch(/application\/json/);
      expect(res.body.error.code).toBe('NOT_FOUND');
    }
  });

  it('never sends a stack trace: an unexpected error becomes 500 INTERNAL', async () => {
    const app = express();
    app.get('/boom', () => {
      throw new Error('secret detail at /srv/app/db.ts:42');
    });
    app.use(errorHandler(createLogger('silent', 't')));
    const res = await request(app).get('/boom');
    expect(res.status).toBe(500);
    expect(res.body).toEqual({ error: { code: 'INTERNAL', message: 'Something went wrong on the server; it has been logged' } });
    expect(res.text).not.toMatch(/secret detail|at \//);
  });

  it('turns an AppError and a zod error into the shape with fields', async () => {
    const app = express();
    app.get('/app-error', () => {
      throw new AppError('TEAPOT', 418, 'Short and stout', { spout: 'missing' });
    });
    app.get('/zod-error', () => {
      z.object({ items: z.array(z.object({ name: z.string() })) }).parse({ items: [{ name: 'ok' }, { name: 3 }] });
    });
    app.use(errorHandler(createLogger('silent', 't')));
    const a = await request(app).get('/app-error');
    expect(a.status).toBe(418);
    expect(a.body).toEqual({ error: { code: 'TEAPOT', message: 'Short and stout', fields: { spout: 'missing' } } });
    const b = await request(app).get('/zod-error');
    expect(b.status).toBe(400);
    expect(b.body.error.code).toBe('VALIDATION');
    expect(Object.keys(b.body.error.fields)).toEqual(['items.1.name']);
  });

  it('answers 413 TOO_LARGE for a body over 1 MB', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/signin')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.example.com', password: 'x'.repeat(1_100_000) }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('TOO_LARGE');
  });
});

describe('security headers (helmet)', () => {
  it('sends a Content-Security-Policy that lets the exported bundle and a WebAssembly 3D viewer run (CSP Level 3 directives)', async () => {
    const res = await request(ctx.app).get('/api/health');
    const csp = String(res.headers['content-security-policy']);
    const directives = Object.fromEntries(csp.split(';').map((d) => d.trim().split(/\s+/)).map(([k, ...v]) => [k, v]));
    expect(directives['default-src']).toEqual(["'self'"]);
    expect(directives['script-src']).toEqual(["'self'", "'wasm-unsafe-eval'"]);
    expect(directives['script-src']).not.toContain("'unsafe-inline'");
    expect(directives['style-src']).toContain("'unsafe-inline'");
    expect(directives['img-src']).toEqual(expect.arrayContaining(['data:', 'blob:']));
    expect(directives['worker-src']).toEqual(expect.arrayContaining(["'self'", 'blob:']));
    expect(directives['frame-ancestors']).toEqual(["'none'"]);
    expect(csp).not.toMatch(/upgrade-insecure-requests/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('web app', () => {
  let webRoot: string;
  let served: TestContext;
  beforeAll(async () => {
    webRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'sheetsmith-web-'));
    fs.mkdirSync(path.join(webRoot, '_expo', 'static', 'js'), { recursive: true });
    fs.writeFileSync(path.join(webRoot, 'index.html'), '<!doctype html><title>Sheetsmith test shell</title><div id="root"></div>');
    fs.writeFileSync(path.join(webRoot, '_expo', 'static', 'js', 'entry-abc123.js'), 'console.log(1)');
    served = await makeTestApp({ env: { WEB_ROOT: webRoot } });
  });
  afterAll(async () => {
    await served.close();
    fs.rmSync(webRoot, { recursive: true, force: true });
  });

  it('serves index.html for deep links into the app (single-page fallback) but never for /api', async () => {
    for (const url of ['/', '/builds/abc', '/shops/1/builds/2/pieces']) {
      const res = await request(served.app).get(url);
      expect(res.status, url).toBe(200);
      expect(res.text).toContain('Sheetsmith test shell');
      expect(res.headers['cache-control']).toBe('no-cache');
    }
    expect((await request(served.app).get('/api/builds/abc')).status).toBe(404);
  });

  it('serves hashed bundles with a one-year immutable cache (RFC 8246)', async () => {
    const res = await request(served.app).get('/_expo/static/js/entry-abc123.js');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('answers 503 "web app not built" when the web root is missing', async () => {
    const res = await request(ctx.app).get('/builds');
    expect(res.status).toBe(503);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain('Web app not built');
    expect(res.headers['retry-after']).toBe('30');
  });
});

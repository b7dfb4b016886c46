import { randomUUID } from 'node:crypto';
import type { Options } from 'express-rate-limit';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PostgresRateLimitStore } from '../../server/auth/rate-limit-store';
import { makeTestApp, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(async () => {
  await ctx.close();
});

function storeWithWindow(windowMs: number): PostgresRateLimitStore {
  const store = new PostgresRateLimitStore(ctx.db, `test-${randomUUID()}:`);
  store.init({ windowMs } as Options);
  return store;
}

describe('PostgresRateLimitStore', () => {
  it('counts hits per key in a fixed window and reports when the window ends', async () => {
    const store = storeWithWindow(60_000);
    const t0 = Date.now();
    const a1 = await store.increment('a');
    const a2 = await store.increment('a');
    const b1 = await store.increment('b');
    expect([a1.totalHits, a2.totalHits, b1.totalHits]).toEqual([1, 2, 1]);
    // The window end is fixed at the first hit, not pushed back by later ones.
    expect(a2.resetTime!.getTime()).toBe(a1.resetTime!.getTime());
    expect(a1.resetTime!.getTime() - t0).toBeGreaterThan(59_000);
    expect(a1.resetTime!.getTime() - t0).toBeLessThan(61_000);
  });

  it('starts a new window once the old one has ended', async () => {
    const store = storeWithWindow(300);
    await store.increment('k');
    await store.increment('k');
    await new Promise((r) => setTimeout(r, 450));
    const after = await store.increment('k');
    expect(after.totalHits).toBe(1);
  });

  it('decrements without going below zero and forgets a key on reset', async () => {
    const store = storeWithWindow(60_000);
    await store.increment('d');
    await store.decrement('d');
    await store.decrement('d');
    expect((await store.increment('d')).totalHits).toBe(1);
    await store.resetKey('d');
    expect((await store.increment('d')).totalHits).toBe(1);
  });
});

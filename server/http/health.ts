/** GET /api/health: whether the API answers and can reach PostgreSQL (for load balancers and start-up checks). */
import type { Pool } from 'pg';
import { defineRoute, type MountableRoute } from './define-route';

/** Returns whether `SELECT 1` succeeds within `timeoutMs`. */
export async function databaseAnswers(pool: Pool, timeoutMs = 2_000): Promise<boolean> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const timeout = new Promise<boolean>((resolve) => {
    timer = setTimeout(() => resolve(false), timeoutMs);
  });
  const probe = pool.query('SELECT 1').then(
    () => true,
    () => false,
  );
  try {
    return await Promise.race([probe, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

/** Returns the health route: 200 {status:"ok", db:"up"} or 503 {status:"degraded", db:"down"}. */
export function healthRoutes(pool: Pool): MountableRoute[] {
  return [
    defineRoute({
      method: 'GET',
      path: '/api/health',
      access: 'public',
      handler: async ({ res }) => {
        res.setHeader('Cache-Control', 'no-store');
        return (await databaseAnswers(pool))
          ? { status: 200, json: { status: 'ok', db: 'up' } }
          : { status: 503, json: { status: 'degraded', db: 'down' } };
      },
    }),
  ];
}

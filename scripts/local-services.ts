/**
 * The local stand-ins Sheetsmith talks to on one machine, started together by `npm start` before the API and
 * the worker: the mail catcher (SMTP 8471, its message list over HTTP 8472), the payment provider fake (8473),
 * and, with STORAGE=s3, an S3-compatible server (s3rver, 8474, objects under .data/s3). All on loopback.
 *
 *   node --import tsx scripts/local-services.ts
 *
 * Reads HOST/PORT (to give the payment fake the API's webhook URL), PAY_API_KEY, PAY_WEBHOOK_SECRET, STORAGE,
 * S3_BUCKET and the port overrides LOCAL_SMTP_PORT, LOCAL_MAIL_HTTP_PORT, LOCAL_PAY_PORT, LOCAL_S3_PORT.
 * Writes `.data/run/local-services.json` (what runs where) once everything is up, and stops everything on
 * SIGINT/SIGTERM. A service whose module is missing is skipped with a warning; a port already in use is
 * reported and that service skipped (an earlier run probably still holds it).
 */
import { existsSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';

interface Running {
  name: string;
  urls: Record<string, string>;
  close(): Promise<void>;
}

const root = path.resolve(__dirname, '..');
const host = '127.0.0.1';
const env = process.env;
const port = (name: string, fallback: number) => Number(env[name] ?? fallback);
const stateFile = path.join(root, '.data', 'run', 'local-services.json');

function log(message: string): void {
  console.log(`${new Date().toISOString()} local-services: ${message}`);
}

/** Imports a module of ours by repository path, or returns null (with a warning) when the file is not there yet. */
async function optionalModule<T>(relative: string, what: string): Promise<T | null> {
  const file = path.join(root, relative);
  if (!existsSync(file)) {
    log(`WARNING: ${relative} is missing, so the ${what} is not started`);
    return null;
  }
  return (await import(file)) as T;
}

/** Runs `start`, turning "port in use" into a warning and a skipped service. */
async function guarded(name: string, start: () => Promise<Running | null>): Promise<Running | null> {
  try {
    return await start();
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    if (code === 'EADDRINUSE') {
      log(`WARNING: the ${name} could not start: its port is in use (is an earlier run still going? npm start -- --stop)`);
      return null;
    }
    throw new Error(`the ${name} did not start: ${(err as Error).message}`);
  }
}

async function startMail(): Promise<Running | null> {
  const mod = await optionalModule<typeof import('../server/dev/mail-catcher')>('server/dev/mail-catcher.ts', 'mail catcher');
  if (!mod) return null;
  const catcher = await mod.startMailCatcher({ smtpPort: port('LOCAL_SMTP_PORT', 8471), httpPort: port('LOCAL_MAIL_HTTP_PORT', 8472), host });
  return {
    name: 'mail catcher',
    urls: { smtp: `smtp://${host}:${catcher.smtpPort}`, messages: `http://${host}:${catcher.httpPort}/messages` },
    close: () => catcher.close(),
  };
}

async function startPayments(): Promise<Running | null> {
  const mod = await optionalModule<typeof import('../server/dev/payment-fake')>('server/dev/payment-fake.ts', 'payment fake');
  if (!mod) return null;
  const apiKey = env.PAY_API_KEY;
  const webhookSecret = env.PAY_WEBHOOK_SECRET;
  if (!apiKey || !webhookSecret) throw new Error('PAY_API_KEY and PAY_WEBHOOK_SECRET must be set (scripts/start.sh makes them once under .data/)');
  const webhookUrl = `http://${env.HOST ?? host}:${env.PORT ?? '8470'}/api/pay/webhook`;
  const fake = await mod.startPaymentFake({ port: port('LOCAL_PAY_PORT', 8473), host, webhookUrl, webhookSecret, apiKey });
  return { name: 'payment fake', urls: { api: fake.url, webhookTarget: webhookUrl }, close: () => fake.close() };
}

async function startObjectStore(): Promise<Running | null> {
  if (env.STORAGE !== 's3') return null;
  const { startLocalS3 } = await import('../server/storage/local-s3');
  const directory = path.join(root, '.data', 's3');
  mkdirSync(directory, { recursive: true });
  const s3 = await startLocalS3({ host, port: port('LOCAL_S3_PORT', 8474), directory, bucket: env.S3_BUCKET ?? 'sheetsmith' });
  return { name: 's3rver', urls: { endpoint: s3.endpoint }, close: () => s3.close() };
}

async function main(): Promise<void> {
  rmSync(stateFile, { force: true });
  const running: Running[] = [];
  for (const [name, start] of [
    ['mail catcher', startMail],
    ['payment fake', startPayments],
    ['s3rver', startObjectStore],
  ] as const) {
    const service = await guarded(name, start);
    if (service) {
      running.push(service);
      log(`${service.name} up: ${Object.entries(service.urls).map(([k, v]) => `${k} ${v}`).join(', ')}`);
    }
  }
  mkdirSync(path.dirname(stateFile), { recursive: true });
  writeFileSync(stateFile, `${JSON.stringify({ pid: process.pid, services: running.map((s) => ({ name: s.name, urls: s.urls })) }, null, 2)}\n`);
  log('ready');

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    log(`stopping (${signal})`);
    rmSync(stateFile, { force: true });
    Promise.allSettled(running.map((s) => s.close())).then(() => process.exit(0));
    setTimeout(() => process.exit(0), 5_000);
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main().catch((err: unknown) => {
  console.error(`local-services: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});

/**
 * The server's settings, read from the environment once at start-up and checked with zod, so a bad value
 * stops the process with a message naming the variable instead of failing later on a request.
 */
import { z } from 'zod';
import { DEFAULT_DATABASE_URL } from '../db/client';

/** Payment settings that work with the local fake only; refused in production. */
const LOCAL_PAY_API_KEY = 'local-pay-key-for-development';
const LOCAL_PAY_WEBHOOK_SECRET = 'local-webhook-secret-for-development';

const LOG_LEVELS = ['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'] as const;

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
    DATABASE_URL: z
      .string()
      .regex(/^postgres(ql)?:\/\//, 'must be a postgres:// URL')
      .default(DEFAULT_DATABASE_URL),
    HOST: z.string().min(1).default('127.0.0.1'),
    PORT: z.coerce.number().int().min(1).max(65_535).default(8470),
    SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
    WEB_ROOT: z.string().min(1).default('dist'),
    /** Directory of the local-disk file store (print sets and other generated files). */
    FILES_DIR: z.string().min(1).default('.data/files'),
    COOKIE_SECURE: z.enum(['auto', 'true', 'false']).default('auto'),
    TRUST_PROXY: z.string().default('loopback'),
    LOG_LEVEL: z.enum(LOG_LEVELS).default('info'),
    SIGNIN_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
    SIGNIN_RATE_WINDOW_MINUTES: z.coerce.number().positive().default(15),
    /** Sign-up attempts allowed per client address per window (server/auth/sign-up-limit.ts). */
    SIGNUP_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
    SIGNUP_RATE_WINDOW_MINUTES: z.coerce.number().positive().default(60),
    /** Where stored files go: `disk` (FILES_DIR, the default) or `s3` (an S3-compatible store, settings below). */
    STORAGE: z.enum(['disk', 's3']).default('disk'),
    /** S3 API base URL, e.g. http://127.0.0.1:8474 for the local s3rver; unset = the provider's default endpoint. */
    S3_ENDPOINT: z.string().url('must be a URL such as http://127.0.0.1:8474').optional(),
    S3_BUCKET: z.string().min(3).default('sheetsmith'),
    S3_REGION: z.string().min(1).default('us-east-1'),
    S3_ACCESS_KEY_ID: z.string().min(1).optional(),
    S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
    /** HTTP API of the local mail catcher (server/dev/mail-catcher.ts); the admin mail page reads it when set. */
    MAIL_CATCHER_URL: z.string().url('must be a URL such as http://127.0.0.1:8472').optional(),
    /** How often a worker expires stuck jobs and archives old ones (pg-boss maintenance), in seconds. */
    JOB_MAINTENANCE_SECONDS: z.coerce.number().int().min(1).default(120),
    /** Overrides every queue's job expiry (seconds) when set; the fault tests use a short one. */
    JOB_EXPIRE_SECONDS: z.coerce.number().int().min(1).optional(),
    /** Where e-mail goes: an smtp:// or smtps:// URL (the local mail catcher by default, server/dev/mail-catcher.ts). */
    SMTP_URL: z
      .string()
      .regex(/^smtps?:\/\//, 'must be an smtp:// or smtps:// URL')
      .default('smtp://127.0.0.1:8471'),
    /** Sender of every e-mail, "Name <address>". */
    MAIL_FROM: z.string().min(3).default('Sheetsmith <no-reply@sheetsmith.example.com>'),
    /** Origin people reach the app at, used for links in e-mails; defaults to http://HOST:PORT. */
    PUBLIC_URL: z.string().url('must be a URL such as https://sheetsmith.example.com').optional(),
    /** Password-reset requests allowed per client address, and per e-mail address, per window. */
    PASSWORD_RESET_RATE_LIMIT_IP: z.coerce.number().int().min(1).default(10),
    PASSWORD_RESET_RATE_LIMIT_EMAIL: z.coerce.number().int().min(1).default(3),
    PASSWORD_RESET_RATE_WINDOW_MINUTES: z.coerce.number().positive().default(60),
    /** Invitation e-mails (new and resent) one shop may send per hour; bounds what a shop can mail to strangers. */
    INVITATION_RATE_LIMIT: z.coerce.number().int().min(1).default(30),
    /** Payment API base URL (the provider's SDK is pointed here); locally the fake of server/dev/payment-fake.ts. */
    PAY_API_URL: z.string().url('must be a URL such as http://127.0.0.1:8473').default('http://127.0.0.1:8473'),
    /** Secret API key for the payment API; the local default matches the fake started by the start command. */
    PAY_API_KEY: z.string().min(8, 'must be at least 8 characters').default(LOCAL_PAY_API_KEY),
    /** Secret that signs the payment webhook's events (checked with the SDK's constructEvent). */
    PAY_WEBHOOK_SECRET: z.string().min(16, 'must be at least 16 characters').default(LOCAL_PAY_WEBHOOK_SECRET),
    /** How long a pack's download link works, in hours, and how many file downloads it allows. */
    DOWNLOAD_LINK_HOURS: z.coerce.number().positive().default(24),
    DOWNLOAD_LINK_MAX_USES: z.coerce.number().int().min(1).default(5),
    /** Pack checkouts (paid or free) allowed per client address per window (server/packs/checkout-limit.ts). */
    CHECKOUT_RATE_LIMIT: z.coerce.number().int().min(1).default(30),
    CHECKOUT_RATE_WINDOW_MINUTES: z.coerce.number().positive().default(60),
    /** Largest sculpt upload in bytes (DESIGN.md "Sculpt in": 200 MB); tests set a small one. */
    SCULPT_MAX_UPLOAD_BYTES: z.coerce.number().int().min(1).default(200 * 1024 * 1024),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV === 'production' && !env.SESSION_SECRET) {
      ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'is required when NODE_ENV=production' });
    }
    // The local defaults are public (they are in this file), so anyone could forge a "paid" webhook with them.
    if (env.NODE_ENV === 'production') {
      if (env.PAY_API_KEY === LOCAL_PAY_API_KEY) ctx.addIssue({ code: 'custom', path: ['PAY_API_KEY'], message: 'must be set to the payment provider\'s key when NODE_ENV=production' });
      if (env.PAY_WEBHOOK_SECRET === LOCAL_PAY_WEBHOOK_SECRET) {
        ctx.addIssue({ code: 'custom', path: ['PAY_WEBHOOK_SECRET'], message: 'must be set to the webhook signing secret when NODE_ENV=production' });
      }
    }
    if (env.STORAGE === 's3') {
      for (const name of ['S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY'] as const) {
        if (!env[name]) ctx.addIssue({ code: 'custom', path: [name], message: 'is required when STORAGE=s3' });
      }
    }
  });

export type Env = z.infer<typeof envSchema>;

/**
 * Returns the parsed settings from `source` (normally process.env). Throws an Error whose message lists every
 * bad variable as `NAME: problem`, one per line.
 */
export function parseEnv(source: Record<string, string | undefined>): Env {
  const blankAsMissing = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== undefined && v !== ''));
  const parsed = envSchema.safeParse(blankAsMissing);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.') || '(environment)'}: ${issue.message}`);
    throw new Error(`bad environment settings:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

/**
 * The server's settings, read from the environment once at start-up and checked with zod, so a bad value
 * stops the process with a message naming the variable instead of failing later on a request.
 */
import { z } from 'zod';
import { DEFAULT_DATABASE_URL } from '../db/client';

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
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV === 'production' && !env.SESSION_SECRET) {
      ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'is required when NODE_ENV=production' });
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

/**
 * Builds the Express application: security headers, logging, JSON bodies, every API route through the access
 * table, the web app, and the one error handler. Tests drive it in-process; server/index.ts makes it listen.
 */
import cookieParser from 'cookie-parser';
import express, { type Express, type Request } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Pool } from 'pg';
import type { Db } from '../db/client';
import { adminRoutes } from './admin/router';
import { auditRoutes } from './audit/router';
import { crewRoutes } from './members/crew-routes';
import { createAccessGuard } from './auth/guard';
import { authRoutes } from './auth/router';
import { sessionKey } from './auth/session';
import type { SignInLimitOptions } from './auth/sign-in-limit';
import type { SignUpLimitOptions } from './auth/sign-up-limit';
import { buildRoutes } from './builds/router';
import type { Env } from './env';
import { AppError, errorHandler } from './errors';
import { mountRoutes, type MountableRoute } from './http/define-route';
import { healthRoutes } from './http/health';
import { webAppRouter } from './http/web-app';
import { createLogger } from './logger';
import type { JobAdmin } from './jobs/job-admin';
import type { JobSender } from './jobs/job-sender';
import { PRINT_SET_BODY_LIMIT, PRINT_SETS_PATH, printSetRoutes } from './print-sets/router';
import { shopRoutes } from './shops/router';
import { SEAMS_BODY_LIMIT, SEAMS_PATH, sculptRoutes } from './sculpts/router';
import { patternRoutes } from './patterns/router';
import { pieceRoutes } from './pieces/router';
import { stockRoutes } from './stock/router';
import { sheetPlanRoutes } from './sheet-plans/router';
import { benchRoutes } from './bench/router';
import type { FileStore } from './storage/file-store';
import { createFileStore } from './storage/create-file-store';
import { downloadRoutes } from './downloads/router';
import { publicUrl } from './mail/public-url';
import { createMailer, type Mailer } from './mail/send-mail';
import { orderRoutes } from './orders/router';
import type { CheckoutLimitOptions } from './packs/checkout-limit';
import { PACK_COVER_JSON_LIMIT, PACK_COVER_PATH } from './packs/cover-upload';
import { packRoutes } from './packs/router';
import { createPaymentGateway, type PaymentGateway } from './pay/payment-gateway';
import { payRoutes, WEBHOOK_BODY_LIMIT, WEBHOOK_PATH } from './pay/router';

export interface AppDeps {
  env: Env;
  pool: Pool;
  db: Db;
  /** HS256 key material, at least 32 characters. */
  sessionSecret: string;
  logger?: Logger;
  /** Overrides the sign-in limit from the environment (tests use a small one). */
  signInLimit?: SignInLimitOptions;
  /**
   * Overrides the sign-up limit from the environment; null turns it off (API tests about other things, which
   * all sign up from one loopback address and would otherwise share one count across test files).
   */
  signUpLimit?: SignUpLimitOptions | null;
  /** Overrides the password-reset limits from the environment; null turns them off (API tests about other things). */
  passwordResetLimit?: import('./password-reset/reset-limit').PasswordResetLimitOptions | null;
  /** Puts heavy work on the job queue; without it, routes that queue work answer 503 QUEUE_UNAVAILABLE. */
  jobs?: JobSender;
  /** Where stored files are kept; defaults to the store the settings name (STORAGE, server/storage/create-file-store.ts). */
  files?: FileStore;
  /** Lets site admins retry failed jobs; without it the retry route answers 503 QUEUE_UNAVAILABLE. */
  jobAdmin?: JobAdmin;
  /** Sends e-mail (invitations, resets, receipts, pack published); without it a mailer on SMTP_URL is made. */
  mailer?: Mailer;
  /** The payment provider; defaults to its SDK on PAY_API_URL; null turns paid checkout and refunds off (503). */
  payments?: PaymentGateway | null;
  /** Overrides the pack checkout limit from the environment; null turns it off. */
  checkoutLimit?: CheckoutLimitOptions | null;
}

/** Returns every API route of the server (used to mount them and by the tests that walk the access table). */
export function allRoutes(deps: AppDeps, cookieSecure: (req: Request) => boolean): MountableRoute[] {
  const key = sessionKey(deps.sessionSecret);
  const signInLimit = deps.signInLimit ?? { max: deps.env.SIGNIN_RATE_LIMIT, windowMs: deps.env.SIGNIN_RATE_WINDOW_MINUTES * 60_000 };
  const signUpLimit =
    deps.signUpLimit === undefined ? { max: deps.env.SIGNUP_RATE_LIMIT, windowMs: deps.env.SIGNUP_RATE_WINDOW_MINUTES * 60_000 } : deps.signUpLimit;
  const files = deps.files ?? createFileStore(deps.env);
  return [
    ...healthRoutes(deps.pool),
    ...crewRoutes(deps),
    ...authRoutes({ db: deps.db, sessionKey: key, cookieSecure, signInLimit, signUpLimit }),
    ...shopRoutes(deps.db),
    ...buildRoutes({ db: deps.db, files }),
    ...printSetRoutes({ db: deps.db, files, jobs: deps.jobs ?? null }),
    ...auditRoutes(deps.db),
    ...adminRoutes({ db: deps.db, pool: deps.pool, env: deps.env, jobAdmin: deps.jobAdmin ?? null, payments: deps.payments === undefined ? createPaymentGateway(deps.env) : deps.payments }),
    ...sculptRoutes({ db: deps.db, files, jobs: deps.jobs ?? null, maxUploadBytes: deps.env.SCULPT_MAX_UPLOAD_BYTES }),
    ...patternRoutes({ db: deps.db, files, jobs: deps.jobs ?? null }),
    ...pieceRoutes({ db: deps.db, jobs: deps.jobs ?? null }),
    ...stockRoutes(deps.db),
    ...sheetPlanRoutes({ db: deps.db, jobs: deps.jobs ?? null }),
    ...benchRoutes(deps.db),
    ...commerceRoutes(deps, files),
  ];
}

/** Returns the pattern-pack, order, webhook and download routes with their shared settings. */
function commerceRoutes(deps: AppDeps, files: FileStore): MountableRoute[] {
  const payments = deps.payments === undefined ? createPaymentGateway(deps.env) : deps.payments;
  const mailer = deps.mailer ?? createMailer(deps.env, deps.db);
  const logger = deps.logger ?? createLogger(deps.env.LOG_LEVEL, 'api');
  const checkoutLimit = deps.checkoutLimit === undefined ? { max: deps.env.CHECKOUT_RATE_LIMIT, windowMs: deps.env.CHECKOUT_RATE_WINDOW_MINUTES * 60_000 } : deps.checkoutLimit;
  const settings = {
    publicUrl: publicUrl(deps.env),
    linkHours: deps.env.DOWNLOAD_LINK_HOURS,
    linkMaxUses: deps.env.DOWNLOAD_LINK_MAX_USES,
  };
  return [
    ...packRoutes({ db: deps.db, files, mailer, payments, settings, logger, checkoutLimit }),
    ...orderRoutes({ db: deps.db, payments }),
    ...payRoutes({ db: deps.db, payments, mailer, settings, logger }),
    ...downloadRoutes({ db: deps.db, files }),
  ];
}

/**
 * The Content-Security-Policy: the exported web bundle loads its scripts from this origin and sets inline
 * styles; the 3D viewer needs blob:/data: images and workers and WebAssembly compilation.
 */
const CSP_DIRECTIVES = {
  defaultSrc: ["'self'"],
  scriptSrc: ["'self'", "'wasm-unsafe-eval'"],
  styleSrc: ["'self'", "'unsafe-inline'"],
  imgSrc: ["'self'", 'data:', 'blob:'],
  fontSrc: ["'self'", 'data:'],
  workerSrc: ["'self'", 'blob:'],
  connectSrc: ["'self'", 'blob:', 'data:'],
  objectSrc: ["'none'"],
  baseUri: ["'self'"],
  formAction: ["'self'"],
  frameAncestors: ["'none'"],
  // Plain http on loopback is the normal local set-up; upgrading it would break every request.
  upgradeInsecureRequests: null,
};

/**
 * Returns Express's "trust proxy" value for TRUST_PROXY: "true"/"false", a hop count, or addresses and
 * named ranges such as "loopback" (the default: a reverse proxy on the same machine).
 */
export function trustProxySetting(value: string): boolean | number | string {
  if (value === 'true') return true;
  if (value === 'false') return false;
  if (/^\d+$/.test(value)) return Number(value);
  return value;
}

/** Returns the configured Express app; it holds no state besides what `deps` hold. */
export function createApp(deps: AppDeps): Express {
  const logger = deps.logger ?? createLogger(deps.env.LOG_LEVEL, 'api');
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', trustProxySetting(deps.env.TRUST_PROXY));
  const cookieSecure = (req: Request) => (deps.env.COOKIE_SECURE === 'auto' ? req.secure : deps.env.COOKIE_SECURE === 'true');

  app.use(helmet({ contentSecurityPolicy: { useDefaults: true, directives: CSP_DIRECTIVES } }));
  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      // One short line per request: who asked for what and the answer; headers (cookies!) stay out.
      serializers: {
        req: (req: { id: unknown; method: string; url: string; remoteAddress?: string }) => ({ id: req.id, method: req.method, url: req.url, remoteAddress: req.remoteAddress }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  );
  // A pattern document can run to megabytes; every other body stays small. The first parser to read a body
  // marks it read, so the general one below skips these requests.
  app.post(PRINT_SETS_PATH, express.json({ limit: PRINT_SET_BODY_LIMIT }));
  app.put(SEAMS_PATH, express.json({ limit: SEAMS_BODY_LIMIT }));
  // The payment webhook's signature covers the exact bytes sent, so that body stays raw; a cover image may come
  // as a data URL of up to 5 MB.
  app.post(WEBHOOK_PATH, express.raw({ type: () => true, limit: WEBHOOK_BODY_LIMIT }));
  app.put(PACK_COVER_PATH, express.json({ limit: PACK_COVER_JSON_LIMIT }));
  app.use(express.json({ limit: '1mb' }));
  app.use(cookieParser());

  const api = express.Router();
  mountRoutes(api, allRoutes(deps, cookieSecure), createAccessGuard({ db: deps.db, sessionKey: sessionKey(deps.sessionSecret), cookieSecure }));
  app.use(api);
  app.use('/api', (req, _res, next) => {
    next(new AppError('NOT_FOUND', 404, `There is no API route ${req.method} ${req.originalUrl}`));
  });
  app.use(webAppRouter(deps.env.WEB_ROOT));
  app.use((req, _res, next) => {
    next(new AppError('NOT_FOUND', 404, `Nothing is served at ${req.method} ${req.originalUrl}`));
  });
  app.use(errorHandler(logger));
  return app;
}

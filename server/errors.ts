/**
 * The one error type of the HTTP layer and the one handler that turns any failure into the JSON shape
 * `{ "error": { "code", "message", "fields"? } }`. A client never sees a stack trace.
 */
import type { ErrorRequestHandler } from 'express';
import type { Logger } from 'pino';
import { ZodError } from 'zod';

/** Field path (dot-joined, e.g. "email" or "items.2.name") → what is wrong with it. */
export type FieldErrors = Record<string, string>;

/**
 * A failure meant for the client: `code` is a stable machine-readable word (VALIDATION, NOT_FOUND, ...),
 * `status` the HTTP status, `message` a sentence for people, `fields` per-field problems for forms.
 */
export class AppError extends Error {
  constructor(
    readonly code: string,
    readonly status: number,
    message: string,
    readonly fields?: FieldErrors,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

/** Returns the zod issues as field errors, keeping the first message per field path. */
export function fieldErrorsFromZod(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? issue.path.map(String).join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** Returns a 400 VALIDATION AppError for a failed zod parse of the request part `where` (body, path, query). */
export function validationError(error: ZodError, where: 'body' | 'path' | 'query'): AppError {
  const fields = fieldErrorsFromZod(error);
  const names = Object.keys(fields).join(', ');
  return new AppError('VALIDATION', 400, `Some ${where === 'body' ? 'fields' : `${where} values`} are not valid: ${names}`, fields);
}

/** Returns a 404 NOT_FOUND AppError saying that `what` (e.g. "Build") was not found. */
export function notFound(what: string): AppError {
  return new AppError('NOT_FOUND', 404, `${what} was not found`);
}

interface BodyParserError {
  type?: string;
  message?: string;
}

function fromBodyParser(err: unknown): AppError | null {
  const type = (err as BodyParserError | null)?.type;
  if (type === 'entity.parse.failed') {
    // JSON.parse's own message says where it stopped, e.g. "... in JSON at position 13".
    const where = (err as BodyParserError).message ?? '';
    return new AppError('BAD_JSON', 400, `The request body is not valid JSON${where ? `: ${where}` : ''}`);
  }
  if (type === 'entity.too.large') return new AppError('TOO_LARGE', 413, 'The request body is too large');
  if (type === 'encoding.unsupported' || type === 'charset.unsupported') {
    return new AppError('BAD_ENCODING', 415, 'The request body encoding is not supported; send UTF-8 JSON');
  }
  return null;
}

/** Node socket errors that mean the database cannot be reached (connection refused, dropped or timed out). */
const UNREACHABLE_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND', 'EPIPE']);

/**
 * Returns whether `err` (or an error it wraps, e.g. a Drizzle query error's `cause`) says PostgreSQL is down or
 * going away rather than that the query was wrong: a socket error, SQLSTATE class 08 (connection exception),
 * 57P01–57P03 (shutdown, crash, cannot connect now; PostgreSQL manual, appendix A), or node-postgres's own
 * "Connection terminated" and connect-timeout messages.
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err, depth = 0; e && depth < 5; e = (e as { cause?: unknown }).cause, depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && (UNREACHABLE_CODES.has(code) || code.startsWith('08') || ['57P01', '57P02', '57P03'].includes(code))) return true;
    const message = (e as { message?: unknown }).message;
    if (typeof message === 'string' && /^Connection terminated|timeout exceeded when trying to connect|Client has encountered a connection error/.test(message)) return true;
  }
  return false;
}

function fromDatabaseOutage(err: unknown): AppError | null {
  if (!isDatabaseUnavailable(err)) return null;
  return new AppError('DATABASE_UNAVAILABLE', 503, 'The database cannot be reached right now; try again in a moment');
}

/**
 * Returns the Express error handler. Known failures keep their code and status; anything else is logged
 * with its stack and answered as a plain 500 INTERNAL.
 */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) {
      next(err);
      return;
    }
    const known =
      err instanceof AppError ? err : err instanceof ZodError ? validationError(err, 'body') : (fromBodyParser(err) ?? fromDatabaseOutage(err));
    const appError = known ?? new AppError('INTERNAL', 500, 'Something went wrong on the server; it has been logged');
    if (!known) logger.error({ err, method: req.method, url: req.originalUrl }, 'unhandled error');
    if (known?.code === 'DATABASE_UNAVAILABLE') {
      logger.warn({ err: { message: (err as Error).message, code: (err as { code?: unknown }).code }, method: req.method, url: req.originalUrl }, 'database unavailable');
      res.setHeader('Retry-After', '5');
    }
    res.status(appError.status).json({
      error: {
        code: appError.code,
        message: appError.message,
        ...(appError.fields ? { fields: appError.fields } : {}),
      },
    });
  };
}

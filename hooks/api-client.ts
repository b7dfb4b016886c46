/**
 * The app's HTTP client for the Sheetsmith API: same origin, cookie session, JSON in and out.
 * Every failure becomes an ApiError carrying the server's `{ error: { code, message, fields? } }`.
 */
import type { z } from 'zod';

/** Field name → message, flattened from the server's `fields` (which may hold one message or a list). */
export type FieldMessages = Record<string, string>;

/** A failed API call: the HTTP status (0 when the server could not be reached), the server's code and message. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: FieldMessages;
  /** The parsed body of the failed answer (undefined when there was none or it was not JSON), for routes whose
   * error carries more than a message, such as the current seam set beside a 409. */
  readonly body: unknown;

  constructor(status: number, code: string, message: string, fields: FieldMessages = {}, body?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.body = body;
  }
}

/** Messages for failures whose body carries no usable message of its own, by HTTP status. */
const fallbackMessages: Record<number, string> = {
  401: 'You are signed out. Sign in again to continue.',
  403: 'Your role in this shop does not allow that.',
  404: 'That was not found. It may have been deleted.',
  429: 'Too many attempts in a short time. Wait a few minutes, then try again.',
};

function flattenFields(raw: unknown): FieldMessages {
  if (!raw || typeof raw !== 'object') return {};
  const out: FieldMessages = {};
  for (const [name, value] of Object.entries(raw as Record<string, unknown>)) {
    if (typeof value === 'string' && value) out[name] = value;
    else if (Array.isArray(value)) {
      const first = value.find((v): v is string => typeof v === 'string' && v.length > 0);
      if (first) out[name] = first;
    }
  }
  return out;
}

/**
 * Builds the ApiError for a non-2xx response from its status and parsed body (or `undefined` when the body was
 * not JSON). Follows the API contract's error shape `{ error: { code, message, fields? } }`; anything else
 * gets a code `HTTP_<status>` and a message that names the status.
 */
export function apiErrorFromResponse(status: number, body: unknown): ApiError {
  const err = body && typeof body === 'object' ? (body as { error?: unknown }).error : undefined;
  if (err && typeof err === 'object') {
    const { code, message, fields } = err as { code?: unknown; message?: unknown; fields?: unknown };
    const codeText = typeof code === 'string' && code ? code : `HTTP_${status}`;
    const messageText =
      typeof message === 'string' && message ? message : (fallbackMessages[status] ?? `The server answered ${status}.`);
    return new ApiError(status, codeText, messageText, flattenFields(fields), body);
  }
  return new ApiError(
    status,
    `HTTP_${status}`,
    fallbackMessages[status] ?? `The server answered ${status} without an explanation. Try again in a moment.`,
    {},
    body,
  );
}

export type HttpMethod = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

/**
 * Calls `method path` on the API (path starts with `/api/`), sending `body` as JSON when given, and returns the
 * parsed response checked against `schema` (or `undefined` for 204). Throws ApiError: status 0 / code NETWORK
 * when the server cannot be reached, the server's error for a non-2xx answer, code BAD_RESPONSE when a 2xx
 * answer does not match `schema` (naming the first mismatching field).
 */
export async function apiRequest<S extends z.ZodType>(
  method: HttpMethod,
  path: string,
  schema: S | null,
  body?: unknown,
): Promise<z.infer<S>> {
  let res: Response;
  try {
    res = await fetch(path, {
      method,
      credentials: 'same-origin',
      headers: body === undefined ? { Accept: 'application/json' } : { Accept: 'application/json', 'Content-Type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'NETWORK', 'Cannot reach the Sheetsmith server. Check your connection and try again.');
  }
  const text = await res.text();
  let parsed: unknown;
  if (text) {
    try {
      parsed = JSON.parse(text);
    } catch {
      parsed = undefined;
    }
  }
  if (!res.ok) throw apiErrorFromResponse(res.status, parsed);
  if (schema === null || res.status === 204) return undefined as z.infer<S>;
  const checked = schema.safeParse(parsed);
  if (!checked.success) {
    const issue = checked.error.issues[0];
    const where = issue && issue.path.length ? issue.path.join('.') : 'the body';
    throw new ApiError(
      res.status,
      'BAD_RESPONSE',
      `The server's answer to ${method} ${path} was not understood (${where}: ${issue?.message ?? 'unexpected shape'}).`,
    );
  }
  return checked.data;
}

/**
 * GETs the binary file at `url` (same origin, cookie session) and returns `decode` of its bytes. `what` names the
 * file for the message when the bytes cannot be decoded, e.g. "The sculpt's working mesh". Throws ApiError: status
 * 0 / code NETWORK when the server cannot be reached, the server's error (API contract shape) for a non-2xx answer,
 * code BAD_RESPONSE with `decode`'s message when the bytes are not a valid file.
 */
export async function fetchBytes<T>(url: string, decode: (bytes: Uint8Array) => T, what: string): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, { credentials: 'same-origin', headers: { Accept: 'application/octet-stream' } });
  } catch {
    throw new ApiError(0, 'NETWORK', 'Cannot reach the Sheetsmith server. Check your connection and try again.');
  }
  if (!res.ok) {
    let body: unknown;
    try {
      body = await res.json();
    } catch {
      body = undefined;
    }
    throw apiErrorFromResponse(res.status, body);
  }
  try {
    return decode(new Uint8Array(await res.arrayBuffer()));
  } catch (e) {
    throw new ApiError(res.status, 'BAD_RESPONSE', `${what} could not be read: ${(e as Error).message}`);
  }
}

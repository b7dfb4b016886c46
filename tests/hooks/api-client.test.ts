import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, apiErrorFromResponse, apiRequest } from '../../hooks/api-client';
import { buildEnvelopeSchema, meSchema } from '../../hooks/api-types';

// The error shape `{ error: { code, message, fields? } }` and the status codes per endpoint are the API
// contract of issue 2 (and the H2 brief's API list); status meanings follow RFC 9110 (204 has no content)
// and RFC 6585 §4 (429 Too Many Requests).

function respondWith(status: number, body: string | null, contentType = 'application/json') {
  const fetchMock = vi.fn(async () => new Response(body, { status, headers: body === null ? {} : { 'Content-Type': contentType } }));
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('apiErrorFromResponse', () => {
  it('keeps the code, message and field messages of the contract shape', () => {
    const e = apiErrorFromResponse(409, {
      error: { code: 'EMAIL_TAKEN', message: 'That e-mail already has an account.', fields: { email: 'Already registered' } },
    });
    expect(e).toBeInstanceOf(ApiError);
    expect([e.status, e.code, e.message]).toEqual([409, 'EMAIL_TAKEN', 'That e-mail already has an account.']);
    expect(e.fields).toEqual({ email: 'Already registered' });
  });

  it('takes the first message when a field carries a list (zod flatten() form)', () => {
    const e = apiErrorFromResponse(400, {
      error: { code: 'VALIDATION', message: 'Check the marked fields.', fields: { password: ['Use at least 10 characters', 'x'], name: [] } },
    });
    expect(e.fields).toEqual({ password: 'Use at least 10 characters' });
  });

  it('names the status when the body is not the contract shape (e.g. a proxy page)', () => {
    const e = apiErrorFromResponse(502, undefined);
    expect(e.code).toBe('HTTP_502');
    expect(e.message).toContain('502');
  });

  it('explains a 429 without a message as too many attempts (RFC 6585 §4)', () => {
    const e = apiErrorFromResponse(429, { error: { code: 'RATE_LIMITED' } });
    expect(e.code).toBe('RATE_LIMITED');
    expect(e.message).toMatch(/too many attempts/i);
  });
});

describe('apiRequest', () => {
  it('sends JSON with the session cookie and checks the answer against the schema', async () => {
    const fetchMock = respondWith(
      201,
      JSON.stringify({ build: { id: 7, shopId: 3, name: 'Gorget', createdAt: '2026-03-04T14:05:00.000Z', updatedAt: '2026-03-04T14:05:00.000Z' } }),
    );
    const out = await apiRequest('POST', '/api/shops/3/builds', buildEnvelopeSchema, { name: 'Gorget' });
    // Numeric ids from the server are kept as strings so route params and cache keys compare equal.
    expect(out.build).toMatchObject({ id: '7', shopId: '3', name: 'Gorget' });
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/shops/3/builds');
    expect(init.method).toBe('POST');
    expect(init.credentials).toBe('same-origin');
    expect(init.body).toBe('{"name":"Gorget"}');
    expect((init.headers as Record<string, string>)['Content-Type']).toBe('application/json');
  });

  it('resolves to undefined for 204 No Content (RFC 9110 §15.3.5)', async () => {
    respondWith(204, null);
    await expect(apiRequest('POST', '/api/auth/signout', null)).resolves.toBeUndefined();
  });

  it('throws the server error for a 401 BAD_CREDENTIALS', async () => {
    respondWith(401, JSON.stringify({ error: { code: 'BAD_CREDENTIALS', message: 'E-mail or password is wrong.' } }));
    await expect(apiRequest('POST', '/api/auth/signin', meSchema, { email: 'a@b.co', password: 'x' })).rejects.toMatchObject({
      status: 401,
      code: 'BAD_CREDENTIALS',
      message: 'E-mail or password is wrong.',
    });
  });

  it('reports a non-JSON error page by its status', async () => {
    respondWith(500, '<html>Internal error</html>', 'text/html');
    await expect(apiRequest('GET', '/api/me', meSchema)).rejects.toMatchObject({ status: 500, code: 'HTTP_500' });
  });

  it('reports an unreachable server as NETWORK with status 0', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    await expect(apiRequest('GET', '/api/me', meSchema)).rejects.toMatchObject({ status: 0, code: 'NETWORK' });
  });

  it('names the field when a 2xx answer does not match the expected shape', async () => {
    respondWith(200, JSON.stringify({ user: { id: 1, email: 'a@b.co', name: 'A' }, memberships: [{ shopId: 1, shopName: 'S', role: 'boss' }] }));
    const err = await apiRequest('GET', '/api/me', meSchema).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect((err as ApiError).code).toBe('BAD_RESPONSE');
    expect((err as ApiError).message).toContain('memberships.0.role');
  });
});

describe('PUT through apiRequest', () => {
  it('sends the JSON body with PUT and keeps the answer body on the error, for routes that answer 409 with more than a message', async () => {
    const current = { revision: 4, note: 'the other editor’s seams' };
    const fetchMock = respondWith(409, JSON.stringify({ error: { code: 'SEAMS_CHANGED', message: 'Someone else changed the seams.' }, current }));
    const err = await apiRequest('PUT', '/api/x', null, { baseRevision: 3 }).catch((e: unknown) => e);
    expect((fetchMock.mock.calls[0] as unknown[])[1]).toMatchObject({ method: 'PUT', body: JSON.stringify({ baseRevision: 3 }) });
    expect(err).toBeInstanceOf(ApiError);
    expect([(err as ApiError).status, (err as ApiError).code]).toEqual([409, 'SEAMS_CHANGED']);
    expect((err as ApiError).body).toEqual({ error: { code: 'SEAMS_CHANGED', message: 'Someone else changed the seams.' }, current });
  });
});

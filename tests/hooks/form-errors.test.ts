import { describe, expect, it } from 'vitest';
import { ApiError } from '../../hooks/api-client';
import { applyServerErrors } from '../../hooks/form-errors';

// Expected behaviour from the H2 brief and issue 2: `fields` of the error shape go under the matching form
// fields; the server's message is shown for BAD_CREDENTIALS, EMAIL_TAKEN (as a field) and 429.

type Form = { name: string; email: string; password: string };

function recorder() {
  const calls: Array<[string, { type: string; message: string }]> = [];
  const setError = ((name: string, err: { type: string; message: string }) => {
    calls.push([name, err]);
  }) as unknown as Parameters<typeof applyServerErrors<Form>>[2];
  return { calls, setError };
}

describe('applyServerErrors', () => {
  it('puts EMAIL_TAKEN under the e-mail field and leaves no form-level message', () => {
    const { calls, setError } = recorder();
    const e = new ApiError(409, 'EMAIL_TAKEN', 'That e-mail already has an account.', { email: 'That e-mail already has an account.' });
    expect(applyServerErrors<Form>(e, ['name', 'email', 'password'], setError)).toBeNull();
    expect(calls).toEqual([['email', { type: 'server', message: 'That e-mail already has an account.' }]]);
  });

  it('returns the message for BAD_CREDENTIALS, which names no field', () => {
    const { calls, setError } = recorder();
    const e = new ApiError(401, 'BAD_CREDENTIALS', 'E-mail or password is wrong.');
    expect(applyServerErrors<Form>(e, ['email', 'password'], setError)).toBe('E-mail or password is wrong.');
    expect(calls).toEqual([]);
  });

  it('returns the message for RATE_LIMITED (429)', () => {
    const { setError } = recorder();
    const e = new ApiError(429, 'RATE_LIMITED', 'Too many sign-in attempts; wait 10 minutes.');
    expect(applyServerErrors<Form>(e, ['email', 'password'], setError)).toBe('Too many sign-in attempts; wait 10 minutes.');
  });

  it('does not lose a field message for a field the form lacks', () => {
    const { calls, setError } = recorder();
    const e = new ApiError(400, 'VALIDATION', 'Check the marked fields.', { email: 'Enter an e-mail', shopId: 'Unknown shop' });
    const msg = applyServerErrors<Form>(e, ['email', 'password'], setError);
    expect(calls.map((c) => c[0])).toEqual(['email']);
    expect(msg).toContain('shopId: Unknown shop');
  });

  it('describes a non-API failure instead of swallowing it', () => {
    const { setError } = recorder();
    expect(applyServerErrors<Form>(new RangeError('bad length'), ['email'], setError)).toContain('bad length');
  });
});

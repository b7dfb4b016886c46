import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadOrCreateSessionSecret } from '../../server/auth/session-secret';
import { trustProxySetting } from '../../server/app';
import { parseEnv } from '../../server/env';

describe('parseEnv', () => {
  it('fills in the documented defaults', () => {
    const env = parseEnv({});
    expect(env).toMatchObject({
      NODE_ENV: 'development',
      DATABASE_URL: 'postgres://postgres@127.0.0.1:54329/sheetsmith',
      HOST: '127.0.0.1',
      PORT: 8470,
      WEB_ROOT: 'dist',
      COOKIE_SECURE: 'auto',
      LOG_LEVEL: 'info',
      SIGNIN_RATE_LIMIT: 10,
      SIGNIN_RATE_WINDOW_MINUTES: 15,
      SIGNUP_RATE_LIMIT: 10,
      SIGNUP_RATE_WINDOW_MINUTES: 60,
    });
    expect(env.SESSION_SECRET).toBeUndefined();
  });

  it('treats empty variables as unset', () => {
    expect(parseEnv({ PORT: '', SESSION_SECRET: '' }).PORT).toBe(8470);
  });

  it('names every bad variable in one message', () => {
    let message = '';
    try {
      parseEnv({ PORT: '70000', DATABASE_URL: 'mysql://x', SESSION_SECRET: 'short', LOG_LEVEL: 'loud' });
    } catch (err) {
      message = (err as Error).message;
    }
    expect(message).toMatch(/^bad environment settings:/);
    expect(message).toMatch(/\n {2}PORT: /);
    expect(message).toMatch(/\n {2}DATABASE_URL: must be a postgres:\/\/ URL/);
    expect(message).toMatch(/\n {2}SESSION_SECRET: must be at least 32 characters/);
    expect(message).toMatch(/\n {2}LOG_LEVEL: /);
  });

  it('names a sign-up limit that is not a whole number of at least 1, or a window that is not positive', () => {
    expect(() => parseEnv({ SIGNUP_RATE_LIMIT: '0' })).toThrow(/\n {2}SIGNUP_RATE_LIMIT: /);
    expect(() => parseEnv({ SIGNUP_RATE_LIMIT: '2.5' })).toThrow(/\n {2}SIGNUP_RATE_LIMIT: /);
    expect(() => parseEnv({ SIGNUP_RATE_WINDOW_MINUTES: '-1' })).toThrow(/\n {2}SIGNUP_RATE_WINDOW_MINUTES: /);
    expect(parseEnv({ SIGNUP_RATE_LIMIT: '25', SIGNUP_RATE_WINDOW_MINUTES: '30' })).toMatchObject({ SIGNUP_RATE_LIMIT: 25, SIGNUP_RATE_WINDOW_MINUTES: 30 });
  });

  it('requires SESSION_SECRET in production', () => {
    expect(() => parseEnv({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET: is required when NODE_ENV=production/);
    const production = { NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(32), PAY_API_KEY: 'k'.repeat(24), PAY_WEBHOOK_SECRET: 'w'.repeat(32) };
    expect(parseEnv(production).SESSION_SECRET).toHaveLength(32);
  });

  it('refuses the local payment key and webhook secret in production', () => {
    expect(() => parseEnv({ NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(32) })).toThrow(/PAY_API_KEY: must be set[\s\S]*PAY_WEBHOOK_SECRET: must be set/);
  });
});

describe('loadOrCreateSessionSecret', () => {
  it('prefers the environment, else creates a private file once and reuses it', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sheetsmith-secret-'));
    const file = path.join(dir, '.data', 'session-secret');
    try {
      expect(loadOrCreateSessionSecret('e'.repeat(40), file)).toBe('e'.repeat(40));
      expect(fs.existsSync(file)).toBe(false);
      const made = loadOrCreateSessionSecret(undefined, file);
      // 48 random bytes in base64url: ceil(48 × 4 / 3) = 64 characters.
      expect(made).toMatch(/^[A-Za-z0-9_-]{64}$/);
      expect(fs.statSync(file).mode & 0o777).toBe(0o600);
      expect(loadOrCreateSessionSecret(undefined, file)).toBe(made);
      fs.writeFileSync(file, 'too-short\n');
      expect(() => loadOrCreateSessionSecret(undefined, file)).toThrow(/shorter than 32 characters/);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('trustProxySetting', () => {
  it('maps TRUST_PROXY to the value types the Express 5 "trust proxy" setting documents (boolean, hop count, address list)', () => {
    expect(trustProxySetting('true')).toBe(true);
    expect(trustProxySetting('false')).toBe(false);
    expect(trustProxySetting('2')).toBe(2);
    expect(trustProxySetting('loopback')).toBe('loopback');
    expect(trustProxySetting('10.0.0.0/8, loopback')).toBe('10.0.0.0/8, loopback');
  });
});

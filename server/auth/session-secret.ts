/**
 * Where the session-signing secret comes from: SESSION_SECRET when set, otherwise a random secret generated
 * once into `.data/session-secret` (git-ignored) so that sessions survive restarts on a developer machine.
 */
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

/** Returns the secret from `fromEnv`, else from `file` (creating it, mode 0600, with 48 random bytes as base64url). */
export function loadOrCreateSessionSecret(fromEnv: string | undefined, file: string): string {
  if (fromEnv) return fromEnv;
  try {
    const stored = fs.readFileSync(file, 'utf8').trim();
    if (stored.length >= 32) return stored;
    throw new Error(`${file} holds a secret shorter than 32 characters; delete the file to have a new one made`);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err;
  }
  const secret = randomBytes(48).toString('base64url');
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}

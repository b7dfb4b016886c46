/**
 * Password hashing with argon2id (RFC 9106), with the parameters of the OWASP Password Storage Cheat Sheet's
 * first argon2id option: 19 MiB memory, 2 iterations, 1 lane.
 */
import argon2 from 'argon2';

const ARGON2_OPTIONS = { type: argon2.argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

/** Returns the PHC-format argon2id hash (`$argon2id$v=19$m=19456,t=2,p=1$salt$hash`) of `password`. */
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, ARGON2_OPTIONS);
}

/** Returns whether `password` matches `storedHash`; false (not an exception) for a malformed stored hash. */
export async function verifyPassword(storedHash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(storedHash, password);
  } catch {
    return false;
  }
}

let decoyHash: Promise<string> | null = null;

/**
 * Spends the same time as checking a real password, and resolves to false. Used when the e-mail is unknown so
 * that the answer time does not tell which addresses have accounts (OWASP Authentication Cheat Sheet).
 */
export async function verifyAgainstDecoy(password: string): Promise<false> {
  decoyHash ??= hashPassword('decoy password that no account uses');
  await verifyPassword(await decoyHash, password);
  return false;
}

/** The origin people reach the app at, for links in e-mails. */
import type { Env } from '../env';

/**
 * Returns PUBLIC_URL without a trailing slash, or http://HOST:PORT when it is not set. Links are never built
 * from the request's Host header: a forged header would make a reset mail point to someone else's site
 * (OWASP Forgot Password Cheat Sheet, "URL tokens").
 */
export function publicUrl(env: Pick<Env, 'PUBLIC_URL' | 'HOST' | 'PORT'>): string {
  return (env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`).replace(/\/+$/, '');
}

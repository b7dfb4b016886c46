/** The structured logger (pino, JSON lines on stdout) shared by the API server and the worker. */
import pino, { type Logger } from 'pino';

/** Returns a logger at `level` that never writes session cookies or credentials. */
export function createLogger(level: string, name: string): Logger {
  return pino({
    name,
    level,
    redact: {
      paths: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]', '*.password', '*.passwordHash'],
      censor: '[redacted]',
    },
  });
}

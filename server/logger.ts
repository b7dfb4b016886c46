/** The structured logger (pino, JSON lines on stdout) shared by the API server and the worker. */
import pino, { type DestinationStream, type Logger } from 'pino';

/**
 * Returns a logger at `level` that never writes session cookies or credentials, to stdout or to
 * `destination` (tests pass a stream to read what was logged).
 */
export function createLogger(level: string, name: string, destination?: DestinationStream): Logger {
  const options = {
    name,
    level,
    redact: {
      paths: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]', '*.password', '*.passwordHash'],
      censor: '[redacted]',
    },
  };
  return destination ? pino(options, destination) : pino(options);
}

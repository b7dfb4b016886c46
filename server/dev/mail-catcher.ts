/**
 * A local stand-in for a mail server, for development and tests only: it accepts every message over SMTP on
 * loopback (no authentication, no relaying anywhere), parses it, keeps the last 500 in memory (500 unless told otherwise), and lists them
 * as JSON over HTTP:
 *
 *   GET    /messages       newest first: [{ id, from, to, subject, text, html, date }]
 *   GET    /messages/:id   one message
 *   DELETE /messages       forget them all (204)
 */
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/** One caught message as the HTTP API shows it. */
export interface CaughtMail {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  /** ISO 8601 time the catcher received it. */
  date: string;
}

export interface MailCatcherOptions {
  /** SMTP port; 0 picks a free one (tests). */
  smtpPort: number;
  /** HTTP port of the JSON API; 0 picks a free one. */
  httpPort: number;
  /** Address to listen on; loopback by default, since the catcher has no authentication. */
  host?: string;
  /** How many messages to keep (default MAIL_CATCHER_KEEP). */
  keep?: number;
}

export interface MailCatcher {
  /** The ports actually listened on (useful when 0 was asked for). */
  smtpPort: number;
  httpPort: number;
  /** The caught messages, newest first (the same list GET /messages answers). */
  messages(): CaughtMail[];
  close(): Promise<void>;
}

/** How many messages are kept; older ones are dropped so a long-running catcher stays small. */
export const MAIL_CATCHER_KEEP = 500;

/** Largest message accepted (bytes); the product's mails are a few kilobytes. */
const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = field === undefined ? [] : Array.isArray(field) ? field : [field];
  return list.flatMap((a) => a.value.map((v) => v.address ?? '')).filter((a) => a !== '');
}

function sendJson(res: ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { 'Content-Type': 'application/json; charset=utf-8', 'Cache-Control': 'no-store' });
  res.end(JSON.stringify(body));
}

function listen(server: { listen(port: number, host: string, cb: () => void): unknown; once(ev: 'error', cb: (e: Error) => void): unknown }, port: number, host: string): Promise<void> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve());
  });
}

/**
 * Starts the catcher and returns once both ports listen. Rejects when a port is taken (e.g. another catcher is
 * already running on 8471/8472).
 */
export async function startMailCatcher(options: MailCatcherOptions): Promise<MailCatcher> {
  const host = options.host ?? '127.0.0.1';
  const keep = options.keep ?? MAIL_CATCHER_KEEP;
  const kept: CaughtMail[] = [];
  let nextId = 1;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          kept.unshift({
            id: nextId++,
            from: addresses(parsed.from)[0] ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            to: envelopeTo.length > 0 ? envelopeTo : addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
            date: new Date().toISOString(),
          });
          kept.length = Math.min(kept.length, keep);
          callback();
        })
        .catch((err: unknown) => callback(err instanceof Error ? err : new Error(String(err))));
    },
  });

  const http: Server = createServer((req: IncomingMessage, res: ServerResponse) => {
    const url = new URL(req.url ?? '/', 'http://catcher.invalid');
    const one = /^\/messages\/(\d+)$/.exec(url.pathname);
    if (req.method === 'GET' && url.pathname === '/messages') return sendJson(res, 200, kept);
    if (req.method === 'DELETE' && url.pathname === '/messages') {
      kept.length = 0;
      res.writeHead(204).end();
      return;
    }
    if (req.method === 'GET' && one) {
      const found = kept.find((m) => m.id === Number(one[1]));
      return found ? sendJson(res, 200, found) : sendJson(res, 404, { error: `no caught message with id ${one[1]}` });
    }
    sendJson(res, 404, { error: `the mail catcher has no ${req.method} ${url.pathname}; use GET /messages, GET /messages/:id or DELETE /messages` });
  });

  await listen(smtp.server, options.smtpPort, host);
  try {
    await listen(http, options.httpPort, host);
  } catch (err) {
    await new Promise<void>((resolve) => smtp.close(() => resolve()));
    throw err;
  }

  return {
    smtpPort: (smtp.server.address() as AddressInfo).port,
    httpPort: (http.address() as AddressInfo).port,
    messages: () => kept.slice(),
    close: async () => {
      http.closeAllConnections();
      await Promise.all([
        new Promise<void>((resolve) => smtp.close(() => resolve())),
        new Promise<void>((resolve) => http.close(() => resolve())),
      ]);
    },
  };
}

/**
 * What every browser suite (and the studio's first-render bench) needs around its test: where the built web app
 * and the screenshots live, a free port, the app's server and worker as child processes with their output kept
 * for error messages, and headless Chromium started with the flags measured on this kind of machine.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createServer } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser } from 'playwright-core';

/** The repository's root folder. */
export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
/** Folder for the suites' screenshots (ignored by git). */
export const artifacts = path.join(root, 'tests', 'artifacts');
/** True when the web app is built (dist/index.html exists); browser suites skip without it. */
export const haveDist = existsSync(path.join(root, 'dist', 'index.html'));

// Flags measured on this kind of machine (shared/STACK.md).
const chromiumArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--use-angle=swiftshader',
  '--enable-unsafe-swiftshader',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** Starts the system's Chromium headless (SwiftShader WebGL) with the flags of shared/STACK.md. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: '/usr/bin/chromium', args: chromiumArgs });
}

/** Resolves to a TCP port on 127.0.0.1 that was free a moment ago (the OS picks it). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      srv.close(() => (addr && typeof addr === 'object' ? resolve(addr.port) : reject(new Error('no port'))));
    });
  });
}

/** Child processes of the app (server, worker) started by one suite. */
export interface AppProcesses {
  /**
   * Starts `node --import tsx <script>` (path relative to the repository root) with exactly `env`, keeping the
   * last 20,000 characters of its stdout and stderr under `name`.
   */
  start(name: string, script: string, env: NodeJS.ProcessEnv): ChildProcess;
  /**
   * Resolves once GET `url` answers 2xx, polling every 250 ms; rejects after `ms` milliseconds, or as soon as a
   * started child has exited, with the last answer and the children's output.
   */
  waitForHealth(url: string, ms: number): Promise<void>;
  /** The last `chars` characters of each child's output, under its name and exit code. */
  logs(chars?: number): string;
  /** Stops every child still running: SIGTERM, then SIGKILL if it has not exited within 5 s. */
  stop(): Promise<void>;
}

/** A new, empty set of app child processes; its `stop()` belongs in the suite's afterAll. */
export function appProcesses(): AppProcesses {
  const children: { name: string; proc: ChildProcess; log: string }[] = [];
  const logs = (chars = 3000) => children.map((c) => `--- ${c.name} (exit ${c.proc.exitCode}) ---\n${c.log.slice(-chars)}`).join('\n');
  return {
    start(name, script, env) {
      const proc = spawn(process.execPath, ['--import', 'tsx', script], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
      const entry = { name, proc, log: '' };
      const keep = (chunk: Buffer) => {
        entry.log = (entry.log + chunk.toString()).slice(-20_000);
      };
      proc.stdout?.on('data', keep);
      proc.stderr?.on('data', keep);
      children.push(entry);
      return proc;
    },
    async waitForHealth(url, ms) {
      const until = Date.now() + ms;
      let last = 'no answer';
      while (Date.now() < until) {
        const gone = children.find((c) => c.proc.exitCode !== null);
        if (gone) throw new Error(`${gone.name} exited with code ${gone.proc.exitCode} before ${url} answered:\n${logs()}`);
        try {
          const res = await fetch(url);
          if (res.ok) return;
          last = `HTTP ${res.status}: ${(await res.text()).slice(0, 300)}`;
        } catch (e) {
          last = String(e);
        }
        await new Promise((r) => setTimeout(r, 250));
      }
      throw new Error(`${url} did not answer OK within ${ms} ms (last: ${last}). Output:\n${logs()}`);
    },
    logs,
    async stop() {
      await Promise.all(
        children.map(async ({ proc }) => {
          if (proc.exitCode !== null) return;
          const exited = new Promise((r) => proc.once('exit', r));
          proc.kill('SIGTERM');
          await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
          if (proc.exitCode === null) proc.kill('SIGKILL');
        }),
      );
    },
  };
}

/**
 * The page's side of the seam engine: sends requests to the studio's web worker and hands back promises, or,
 * where a worker cannot start, answers the same requests on the page (slower for "suggest pieces", same answers).
 * A running request can be cancelled: the worker is ended and a fresh one is started with the same mesh.
 */
import { answerSeamRequest, prepareSeamMesh, type PreparedSeamMesh, type SeamEngineAnswers, type SeamEngineRequest } from './seam-engine';
import type { SeamWorkerInbound, SeamWorkerOutbound } from './seam-worker';

/** The error a cancelled request's promise is rejected with. */
export class SeamRequestCancelled extends Error {
  constructor() {
    super('cancelled');
    this.name = 'SeamRequestCancelled';
  }
}

/** A seam engine bound to one working mesh. */
export interface SeamEngine {
  /** Answers `request` (see SeamEngineRequest); rejects with the engine's message on bad input. */
  ask<K extends SeamEngineRequest['kind']>(request: Extract<SeamEngineRequest, { kind: K }>): Promise<SeamEngineAnswers[K]>;
  /** Rejects every request still running with SeamRequestCancelled and makes the engine ready for new ones. */
  cancel(): void;
  /** Ends the worker; the engine must not be used afterwards. */
  dispose(): void;
  /** True when requests run in a web worker, false when they run on the page. */
  readonly inWorker: boolean;
}

interface Pending {
  resolve: (answer: never) => void;
  reject: (err: Error) => void;
}

/** Starts the studio's seam worker, or returns null when this browser (or test runner) cannot. */
function defaultWorker(): Worker | null {
  if (typeof Worker === 'undefined') return null;
  try {
    return new Worker(new URL('./seam-worker', import.meta.url));
  } catch {
    return null;
  }
}

/**
 * Starts a seam engine for the working mesh `positions` (Float32Array(3V), mm) and `triangles`
 * (Uint32Array(3F)). `createWorker` makes the worker (default: the studio's seam worker; return null to answer
 * on the page). If the worker fails to load, every request falls back to the page.
 */
export function startSeamEngine(
  positions: Float32Array,
  triangles: Uint32Array,
  createWorker: () => Worker | null = defaultWorker,
): SeamEngine {
  let worker: Worker | null = null;
  let local: PreparedSeamMesh | null = null;
  let nextId = 1;
  let generation = 0;
  const pending = new Map<number, Pending>();

  const onPage = (): PreparedSeamMesh => (local ??= prepareSeamMesh(positions, triangles));

  const failAll = (err: Error) => {
    for (const p of pending.values()) p.reject(err);
    pending.clear();
  };

  const boot = () => {
    worker = createWorker();
    if (!worker) return;
    worker.onmessage = (e: MessageEvent<SeamWorkerOutbound>) => {
      const msg = e.data;
      if (msg.type === 'ready') {
        // Lets tests and benchmarks see that requests run off the page's thread.
        if (typeof performance !== 'undefined' && typeof performance.mark === 'function') performance.mark('studio-seam-worker-ready');
        return;
      }
      if (msg.type === 'failed' && msg.id === -1) {
        // The worker could not prepare the mesh: carry on without it.
        worker?.terminate();
        worker = null;
        failAll(new Error(`the seam worker could not read the mesh: ${msg.message}`));
        return;
      }
      const p = pending.get(msg.id);
      if (!p) return;
      pending.delete(msg.id);
      if (msg.type === 'answer') p.resolve(msg.answer as never);
      else p.reject(new Error(msg.message));
    };
    worker.onerror = (e) => {
      e.preventDefault?.();
      worker?.terminate();
      worker = null;
      failAll(new Error(`the seam worker stopped: ${e.message || 'it could not be loaded'}`));
    };
    const inbound: SeamWorkerInbound = { type: 'mesh', positions, triangles };
    worker.postMessage(inbound);
  };
  boot();

  return {
    get inWorker() {
      return worker !== null;
    },
    ask(request) {
      if (worker) {
        const id = nextId++;
        const w = worker;
        return new Promise((resolve, reject) => {
          pending.set(id, { resolve: resolve as (a: never) => void, reject });
          const inbound: SeamWorkerInbound = { type: 'ask', id, request };
          w.postMessage(inbound);
        });
      }
      const mine = generation;
      // A macrotask first, so the page can paint its "working" state before a long request blocks it.
      return new Promise((resolve, reject) => {
        setTimeout(() => {
          if (mine !== generation) return reject(new SeamRequestCancelled());
          try {
            const answer = answerSeamRequest(onPage(), request);
            if (mine !== generation) reject(new SeamRequestCancelled());
            else resolve(answer);
          } catch (err) {
            reject(err instanceof Error ? err : new Error(String(err)));
          }
        }, 0);
      });
    },
    cancel() {
      generation++;
      if (worker) {
        worker.terminate();
        worker = null;
        failAll(new SeamRequestCancelled());
        boot();
      }
    },
    dispose() {
      generation++;
      worker?.terminate();
      worker = null;
      failAll(new SeamRequestCancelled());
    },
  };
}

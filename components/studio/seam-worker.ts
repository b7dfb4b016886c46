/**
 * The studio's web worker: holds one prepared working mesh and answers seam requests (seam-engine.ts) off the
 * page's thread, so a long "suggest pieces" run keeps the 3D view turning and can be cancelled by ending the
 * worker.
 *
 * Messages in: `{ type: 'mesh', positions, triangles }` once, then `{ type: 'ask', id, request }`.
 * Messages out: `{ type: 'ready' }`, `{ type: 'answer', id, answer }` or `{ type: 'failed', id, message }`.
 */
import { answerSeamRequest, prepareSeamMesh, type PreparedSeamMesh, type SeamEngineRequest } from './seam-engine';

/** A message the page sends to the worker. */
export type SeamWorkerInbound =
  | { type: 'mesh'; positions: Float32Array; triangles: Uint32Array }
  | { type: 'ask'; id: number; request: SeamEngineRequest };

/** A message the worker sends back. */
export type SeamWorkerOutbound =
  | { type: 'ready' }
  | { type: 'answer'; id: number; answer: unknown }
  | { type: 'failed'; id: number; message: string };

interface WorkerScope {
  onmessage: ((e: MessageEvent<SeamWorkerInbound>) => void) | null;
  postMessage(message: SeamWorkerOutbound): void;
}

const scope = globalThis as unknown as WorkerScope;
let prepared: PreparedSeamMesh | null = null;

scope.onmessage = (e) => {
  const msg = e.data;
  if (msg.type === 'mesh') {
    try {
      prepared = prepareSeamMesh(msg.positions, msg.triangles);
      scope.postMessage({ type: 'ready' });
    } catch (err) {
      scope.postMessage({ type: 'failed', id: -1, message: err instanceof Error ? err.message : String(err) });
    }
    return;
  }
  if (!prepared) {
    scope.postMessage({ type: 'failed', id: msg.id, message: 'the seam worker has no mesh yet' });
    return;
  }
  try {
    scope.postMessage({ type: 'answer', id: msg.id, answer: answerSeamRequest(prepared, msg.request) });
  } catch (err) {
    scope.postMessage({ type: 'failed', id: msg.id, message: err instanceof Error ? err.message : String(err) });
  }
};

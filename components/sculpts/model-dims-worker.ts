/**
 * The upload page's web worker: reads a model file with geometry's importModel off the page's thread (a
 * 50 MB scan takes a second or more to parse) and posts back its dimensions.
 *
 * Message in: `{ file: Blob, fileName, units }`. Message out: `{ ok: true, dims }` or `{ ok: false, message }`.
 */
import type { ModelUnit } from '../../geometry/units';
import { measureModel, type ModelDims } from './model-dims';

export type ModelDimsInbound = { file: Blob; fileName: string; units: ModelUnit };
export type ModelDimsOutbound = { ok: true; dims: ModelDims } | { ok: false; message: string };

interface WorkerScope {
  onmessage: ((e: MessageEvent<ModelDimsInbound>) => void) | null;
  postMessage(message: ModelDimsOutbound): void;
}

const scope = globalThis as unknown as WorkerScope;

scope.onmessage = async (e) => {
  try {
    const bytes = new Uint8Array(await e.data.file.arrayBuffer());
    scope.postMessage({ ok: true, dims: measureModel(bytes, e.data.fileName, e.data.units) });
  } catch (err) {
    scope.postMessage({ ok: false, message: err instanceof Error ? err.message : String(err) });
  }
};

/**
 * The page's side of measuring a model file: asks the upload page's web worker, or measures on the page where
 * no worker can start.
 */
import type { ModelUnit } from '../../geometry/units';
import { measureModel, type ModelDims } from './model-dims';
import type { ModelDimsOutbound } from './model-dims-worker';

function startWorker(): Worker | null {
  if (typeof Worker === 'undefined') return null;
  try {
    return new Worker(new URL('./model-dims-worker', import.meta.url));
  } catch {
    return null;
  }
}

async function onPage(file: Blob, fileName: string, units: ModelUnit): Promise<ModelDims> {
  return measureModel(new Uint8Array(await file.arrayBuffer()), fileName, units);
}

/**
 * Resolves to the dimensions of `file` read in `units`, measured in a web worker (one per call, ended when it
 * answers). Falls back to the page when the worker cannot start or fails to load. Rejects with the parser's
 * message when the file does not read.
 */
export function measureModelFile(file: Blob, fileName: string, units: ModelUnit): Promise<ModelDims> {
  const worker = startWorker();
  if (!worker) return onPage(file, fileName, units);
  return new Promise<ModelDims>((resolve, reject) => {
    worker.onmessage = (e: MessageEvent<ModelDimsOutbound>) => {
      worker.terminate();
      if (e.data.ok) resolve(e.data.dims);
      else reject(new Error(e.data.message));
    };
    worker.onerror = (e) => {
      e.preventDefault();
      worker.terminate();
      onPage(file, fileName, units).then(resolve, reject);
    };
    worker.postMessage({ file, fileName, units });
  });
}

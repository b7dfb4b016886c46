/** Reading one whole stored file back into memory (working meshes, faces files, uploaded models for the worker). */
import type { FileStore } from './file-store';

/**
 * Returns the bytes stored under `key`, or null when there is no such file. Reads into one buffer of the
 * stored size, so a large model is held once rather than as a list of chunks plus their concatenation.
 */
export async function readStoredBytes(files: FileStore, key: string): Promise<Uint8Array | null> {
  const file = await files.open(key);
  if (!file) return null;
  const out = new Uint8Array(file.sizeBytes);
  let at = 0;
  for await (const chunk of file.stream) {
    const bytes = chunk as Uint8Array;
    if (at + bytes.length > out.length) {
      file.stream.destroy();
      throw new Error(`stored file ${key} is longer than its recorded size of ${file.sizeBytes} bytes`);
    }
    out.set(bytes, at);
    at += bytes.length;
  }
  if (at !== out.length) throw new Error(`stored file ${key} ended after ${at} of ${file.sizeBytes} bytes`);
  return out;
}

/** Where a sculpt's files live in the FileStore, and reading one whole file back. */
import type { FileStore } from '../storage/file-store';

/** Prefix of every file of sculpt `sculptId` (the id is a database UUID, never a name a person chose). */
export const sculptFilePrefix = (sculptId: string): string => `sculpts/${sculptId}`;
/** Key of the uploaded model file, by its detected format ("obj", "stl" or "ply"). */
export const sculptSourceKey = (sculptId: string, format: string): string => `${sculptFilePrefix(sculptId)}/source.${format}`;
/** Key of the working mesh (geometry/io/working-mesh.ts format). */
export const sculptMeshKey = (sculptId: string): string => `${sculptFilePrefix(sculptId)}/mesh.bin`;

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

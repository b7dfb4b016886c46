/** Reads a whole stored file into memory (working meshes and faces files are a few megabytes at most). */
import type { FileStore } from '../storage/file-store';

/** Returns the bytes stored under `key`, or null when there is no such file. */
export async function readStoredBytes(files: FileStore, key: string): Promise<Uint8Array | null> {
  const file = await files.open(key);
  if (!file) return null;
  const chunks: Buffer[] = [];
  for await (const chunk of file.stream) chunks.push(Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk as Uint8Array));
  const all = Buffer.concat(chunks);
  return new Uint8Array(all.buffer, all.byteOffset, all.byteLength);
}

/**
 * Where stored files live (uploaded sculpts, working meshes, pattern data, print sets, pack covers). The server
 * and the workers see only this interface; local-disk-store.ts and s3-store.ts implement it and
 * create-file-store.ts picks one from the settings. Keys are relative, slash-separated names such as
 * `print-sets/<id>/print-set.pdf`, where `<id>` is a random UUID from the database, so keys cannot be guessed
 * and never carry a name chosen by a user.
 */
import type { Readable } from 'node:stream';

/** An opened stored file: a stream of its bytes and its size. */
export interface StoredFile {
  stream: Readable;
  sizeBytes: number;
}

export interface FileStore {
  /** Stores `bytes` under `key`, replacing what was there; readers never see a half-written file. */
  put(key: string, bytes: Uint8Array): Promise<void>;
  /** Opens the file under `key`; null when there is none. */
  open(key: string): Promise<StoredFile | null>;
  /** Removes the one file under `key`; no error when there is none. */
  remove(key: string): Promise<void>;
  /** Removes every file whose key starts with `prefix/` (and `prefix` itself); no error when none exist. */
  removePrefix(prefix: string): Promise<void>;
}

const SEGMENT = /^[A-Za-z0-9][A-Za-z0-9._-]{0,127}$/;
const MAX_SEGMENTS = 8;

/**
 * Returns the key's segments after checking its shape: 1 to 8 segments of letters, digits, dot, dash and
 * underscore, each starting with a letter or digit (so no "..", no absolute paths, no hidden files). Throws
 * an Error naming the key and the rule it breaks.
 */
export function fileKeySegments(key: string): string[] {
  const parts = key.split('/');
  if (parts.length > MAX_SEGMENTS) throw new Error(`file key "${key}" has more than ${MAX_SEGMENTS} parts`);
  for (const part of parts) {
    if (!SEGMENT.test(part)) {
      throw new Error(`file key "${key}" has a part "${part}" that is not 1–128 letters, digits, ".", "-" or "_" starting with a letter or digit`);
    }
  }
  return parts;
}

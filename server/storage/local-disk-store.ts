/**
 * The file store on local disk (the one-machine default): files under a root directory, by default
 * `.data/files` (setting FILES_DIR). Writes go to a temporary file in the same directory and are renamed into
 * place, which POSIX makes atomic on one file system, so a reader sees the old file or the new one, never a
 * partial one.
 */
import { randomUUID } from 'node:crypto';
import { mkdir, open, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileKeySegments, type FileStore, type StoredFile } from './file-store';

/** Returns a FileStore keeping files under the directory `rootDir` (made absolute; created on first write). */
export function localDiskStore(rootDir: string): FileStore {
  const root = path.resolve(rootDir);
  const pathOf = (key: string) => path.join(root, ...fileKeySegments(key));
  return {
    async put(key, bytes) {
      const target = pathOf(key);
      await mkdir(path.dirname(target), { recursive: true });
      const temp = `${target}.partial-${randomUUID()}`;
      try {
        await writeFile(temp, bytes);
        await rename(temp, target);
      } catch (err) {
        await rm(temp, { force: true });
        throw err;
      }
    },
    async open(key): Promise<StoredFile | null> {
      const target = pathOf(key);
      // Size and bytes come from one open file: a path looked up twice could meet the old file, then the new one
      // a writer renamed into place in between.
      let handle;
      try {
        handle = await open(target, 'r');
      } catch (err) {
        const code = (err as NodeJS.ErrnoException).code;
        if (code === 'ENOENT' || code === 'EISDIR') return null;
        throw err;
      }
      try {
        const info = await handle.stat();
        if (!info.isFile()) {
          await handle.close();
          return null;
        }
        return { stream: handle.createReadStream(), sizeBytes: info.size };
      } catch (err) {
        await handle.close();
        throw err;
      }
    },
    async remove(key) {
      const target = pathOf(key);
      const info = await stat(target).catch((err: NodeJS.ErrnoException) => {
        if (err.code === 'ENOENT') return null;
        throw err;
      });
      // A key naming a directory is a prefix, not a file: removing it here would take other files with it.
      if (info?.isFile()) await rm(target, { force: true });
    },
    async removePrefix(prefix) {
      await rm(pathOf(prefix), { recursive: true, force: true });
    },
  };
}

import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { text } from 'node:stream/consumers';
import { describe, expect, it } from 'vitest';
import { fileKeySegments } from '../../../server/storage/file-store';
import { localDiskStore } from '../../../server/storage/local-disk-store';

const fresh = () => mkdtempSync(path.join(tmpdir(), 'sheetsmith-store-'));
const bytes = (s: string) => new TextEncoder().encode(s);

describe('local disk file store', () => {
  it('stores bytes under a key, reads them back with their size, and replaces them on a second put', async () => {
    const root = fresh();
    const store = localDiskStore(root);
    await store.put('print-sets/abc/pattern.svg', bytes('<svg/>'));
    const first = await store.open('print-sets/abc/pattern.svg');
    expect(first?.sizeBytes).toBe(6);
    expect(await text(first!.stream)).toBe('<svg/>');
    // A multi-byte character: the size is in bytes (UTF-8, RFC 3629: "×" is 2 bytes), not characters.
    await store.put('print-sets/abc/pattern.svg', bytes('100×60'));
    const second = await store.open('print-sets/abc/pattern.svg');
    expect(second?.sizeBytes).toBe(7);
    expect(readFileSync(path.join(root, 'print-sets', 'abc', 'pattern.svg'), 'utf8')).toBe('100×60');
    // The temporary file used for the atomic replace is gone.
    expect(readdirSync(path.join(root, 'print-sets', 'abc'))).toEqual(['pattern.svg']);
    await text(second!.stream);
  });

  it('answers null for a missing file and for a key naming a directory', async () => {
    const store = localDiskStore(fresh());
    expect(await store.open('print-sets/none/x.pdf')).toBeNull();
    await store.put('print-sets/dir/a.txt', bytes('a'));
    expect(await store.open('print-sets/dir')).toBeNull();
  });

  it('removes every file under a prefix and nothing else, and tolerates a prefix with no files', async () => {
    const root = fresh();
    const store = localDiskStore(root);
    await store.put('print-sets/one/a.pdf', bytes('1'));
    await store.put('print-sets/one/b.dxf', bytes('2'));
    await store.put('print-sets/two/a.pdf', bytes('3'));
    await store.removePrefix('print-sets/one');
    expect(await store.open('print-sets/one/a.pdf')).toBeNull();
    expect(await store.open('print-sets/one/b.dxf')).toBeNull();
    expect((await store.open('print-sets/two/a.pdf'))?.sizeBytes).toBe(1);
    await expect(store.removePrefix('print-sets/never')).resolves.toBeUndefined();
  });

  it('refuses keys that could leave the store root, with a message naming the key and the bad part', async () => {
    const store = localDiskStore(fresh());
    for (const key of ['../etc/passwd', '/abs/path', 'a//b', 'print-sets/.hidden', 'print-sets/a b', '']) {
      await expect(store.put(key, bytes('x')), key).rejects.toThrow(/file key ".*" has a part/);
    }
    expect(() => fileKeySegments('a/b/c/d/e/f/g/h/i')).toThrow(/more than 8 parts/);
    expect(fileKeySegments('print-sets/3f1c/print-set.pdf')).toEqual(['print-sets', '3f1c', 'print-set.pdf']);
  });
});

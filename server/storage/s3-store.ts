/**
 * The file store on an S3-compatible object store (any provider speaking the S3 API, or s3rver locally),
 * through the AWS SDK v3. A PutObject is atomic on S3: a reader gets the old object or the whole new one,
 * never part of it, so no temporary names are needed. Path-style addressing (`endpoint/bucket/key`) is used
 * because self-hosted stores and loopback test servers do not serve virtual-host buckets.
 *
 * Atomic replacement of an existing key is the provider's promise (S3 gives it); s3rver, the local stand-in,
 * writes objects in place (its lib/stores/filesystem.js putObject), so features never overwrite a served key:
 * every stored file lives under a new random id and is only served once its database row says it is done.
 */
import { Readable } from 'node:stream';
import {
  DeleteObjectCommand,
  DeleteObjectsCommand,
  GetObjectCommand,
  ListObjectsCommand,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { fileKeySegments, type FileStore, type StoredFile } from './file-store';

export interface S3StoreOptions {
  /** Base URL of the S3 API, e.g. http://127.0.0.1:8474; omit for the provider's default endpoint. */
  endpoint?: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** Keys per listing page and per delete call: the API's maximum, 1000, unless a test asks for small pages. */
  pageSize?: number;
}

/** ListObjects returns and DeleteObjects takes at most this many keys per call (S3 API reference). */
const MAX_PAGE = 1000;

function isMissing(err: unknown): boolean {
  if (err instanceof S3ServiceException) return err.name === 'NoSuchKey' || err.name === 'NotFound' || err.$metadata.httpStatusCode === 404;
  return false;
}

/** Returns an S3 client for the options; checksums only where the API requires them (older S3-compatible stores reject the newer headers). */
export function s3Client(options: S3StoreOptions): S3Client {
  return new S3Client({
    endpoint: options.endpoint,
    region: options.region,
    forcePathStyle: true,
    credentials: { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
}

/**
 * Returns a FileStore keeping files as objects in `options.bucket` (which must exist). Keys are checked with
 * the same rules as on disk (file-store.ts), so a key valid for one store is valid for the other.
 */
export function s3Store(options: S3StoreOptions, client: S3Client = s3Client(options)): FileStore {
  const Bucket = options.bucket;
  const pageSize = Math.min(options.pageSize ?? MAX_PAGE, MAX_PAGE);
  const checked = (key: string) => fileKeySegments(key).join('/');

  async function deleteKeys(keys: string[]): Promise<void> {
    for (let i = 0; i < keys.length; i += pageSize) {
      const batch = keys.slice(i, i + pageSize);
      const out = await client.send(new DeleteObjectsCommand({ Bucket, Delete: { Objects: batch.map((Key) => ({ Key })), Quiet: true } }));
      const failed = (out.Errors ?? []).filter((e) => e.Code !== 'NoSuchKey');
      if (failed.length > 0) {
        throw new Error(`the object store did not delete ${failed.length} file(s), first "${failed[0].Key}": ${failed[0].Message ?? failed[0].Code}`);
      }
    }
  }

  return {
    async put(key, bytes) {
      await client.send(new PutObjectCommand({ Bucket, Key: checked(key), Body: bytes, ContentLength: bytes.byteLength }));
    },
    async open(key): Promise<StoredFile | null> {
      try {
        const out = await client.send(new GetObjectCommand({ Bucket, Key: checked(key) }));
        if (!(out.Body instanceof Readable)) throw new Error(`the object store answered "${key}" without a byte stream`);
        return { stream: out.Body, sizeBytes: out.ContentLength ?? 0 };
      } catch (err) {
        if (isMissing(err)) return null;
        throw err;
      }
    },
    async remove(key) {
      // S3 answers a delete of a missing object with success, which is the contract here too.
      await client.send(new DeleteObjectCommand({ Bucket, Key: checked(key) }));
    },
    async removePrefix(prefix) {
      const base = checked(prefix);
      const keys: string[] = [];
      // Listing version 1 with Marker = last key seen: s3rver's version-2 continuation tokens are made with
      // DES, which OpenSSL 3 (Node 17+) refuses, so a second V2 page fails there (measured); S3 answers both.
      let Marker: string | undefined;
      for (;;) {
        const page = await client.send(new ListObjectsCommand({ Bucket, Prefix: `${base}/`, Marker, MaxKeys: pageSize }));
        for (const item of page.Contents ?? []) if (item.Key) keys.push(item.Key);
        if (!page.IsTruncated || keys.length === 0) break;
        Marker = keys[keys.length - 1];
      }
      keys.push(base);
      await deleteKeys(keys);
    },
  };
}

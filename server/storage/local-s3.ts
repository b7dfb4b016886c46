/**
 * A local S3-compatible server (the `s3rver` package) for development and tests: `npm start` with
 * STORAGE=s3 runs it on 127.0.0.1:8474, and the storage tests run it in-process on a random port. It keeps
 * objects under a directory on disk. Not for production: use a real S3-compatible service there.
 */
import { createRequire } from 'node:module';
import type { AddressInfo } from 'node:net';

/** The part of s3rver's class this module uses (the package ships no type declarations). */
interface S3rverInstance {
  run(): Promise<AddressInfo>;
  close(): Promise<void>;
}
type S3rverClass = new (options: {
  address: string;
  port: number;
  directory: string;
  silent: boolean;
  configureBuckets: { name: string }[];
}) => S3rverInstance;

/** s3rver's fixed development credentials (its documentation: access key "S3RVER", secret "S3RVER"). */
export const LOCAL_S3_CREDENTIALS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } as const;

export interface LocalS3 {
  /** e.g. http://127.0.0.1:8474 */
  endpoint: string;
  port: number;
  close(): Promise<void>;
}

/**
 * Starts s3rver on `host:port` (port 0 = any free port) keeping objects under `directory`, with `bucket`
 * created, and resolves once it listens. Throws when the dev dependency `s3rver` is not installed.
 */
export async function startLocalS3(options: { host: string; port: number; directory: string; bucket: string }): Promise<LocalS3> {
  const require = createRequire(import.meta.url);
  const S3rver = require('s3rver') as S3rverClass;
  const server = new S3rver({
    address: options.host,
    port: options.port,
    directory: options.directory,
    silent: true,
    configureBuckets: [{ name: options.bucket }],
  });
  const address = await server.run();
  return {
    endpoint: `http://${options.host}:${address.port}`,
    port: address.port,
    close: () => server.close(),
  };
}

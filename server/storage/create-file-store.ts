/**
 * Picks the file store from the settings: STORAGE=disk (the one-machine default, files under FILES_DIR) or
 * STORAGE=s3 (an S3-compatible object store named by S3_ENDPOINT, S3_BUCKET, S3_REGION and the key pair).
 * The API server, the worker and the scripts all call this, so they always agree on where files are.
 */
import type { Env } from '../env';
import type { FileStore } from './file-store';
import { localDiskStore } from './local-disk-store';
import { s3Store } from './s3-store';

/** The settings this module reads (a subset of Env, so tests can pass just these). */
export type FileStoreSettings = Pick<Env, 'STORAGE' | 'FILES_DIR' | 'S3_ENDPOINT' | 'S3_BUCKET' | 'S3_REGION' | 'S3_ACCESS_KEY_ID' | 'S3_SECRET_ACCESS_KEY'>;

/**
 * Returns the FileStore the settings name. Throws an Error naming the missing variables when STORAGE=s3
 * lacks a bucket or credentials (env.ts already refuses such settings at start-up; this guards direct callers).
 */
export function createFileStore(settings: FileStoreSettings): FileStore {
  if (settings.STORAGE === 'disk') return localDiskStore(settings.FILES_DIR);
  const missing = (['S3_BUCKET', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY'] as const).filter((k) => !settings[k]);
  if (missing.length > 0) throw new Error(`STORAGE=s3 needs ${missing.join(', ')}`);
  return s3Store({
    endpoint: settings.S3_ENDPOINT,
    bucket: settings.S3_BUCKET!,
    region: settings.S3_REGION,
    accessKeyId: settings.S3_ACCESS_KEY_ID!,
    secretAccessKey: settings.S3_SECRET_ACCESS_KEY!,
  });
}

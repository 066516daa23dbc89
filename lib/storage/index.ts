import path from 'node:path';
import { env } from '@/lib/env';
import type { Storage } from './keys';
import { LocalDiskStorage } from './local-disk';
import { S3Storage } from './s3';

/**
 * Where uploaded files live. Everything outside this folder sees only a storage key
 * ("studies/12/3f…a9.pdf"), never a path, so a cloud driver can replace the local disk without
 * touching the library code.
 */
export type { Storage } from './keys';
export { assertValidKey } from './keys';
export { LocalDiskStorage };

export const DEFAULT_STORAGE_DIR = 'db/data/uploads';

const globalForStorage = globalThis as unknown as { loadbearingStorage?: { dir: string; driver: Storage } };

/**
 * The storage driver for this process: an S3-compatible object store when S3_BUCKET is set
 * (several processes or machines, docs/deployment.md), else the local disk under STORAGE_DIR
 * (default db/data/uploads).
 */
export function storage(): Storage {
  const settings = env();
  if (settings.S3_BUCKET) {
    const where = `s3:${settings.S3_ENDPOINT ?? ''}/${settings.S3_BUCKET}`;
    const cached = globalForStorage.loadbearingStorage;
    if (cached && cached.dir === where) return cached.driver;
    const driver = new S3Storage({
      bucket: settings.S3_BUCKET,
      endpoint: settings.S3_ENDPOINT,
      region: settings.S3_REGION,
      accessKeyId: settings.S3_ACCESS_KEY_ID,
      secretAccessKey: settings.S3_SECRET_ACCESS_KEY,
      // Most S3-compatible stores want path-style URLs; AWS itself (no endpoint) the default.
      forcePathStyle: settings.S3_FORCE_PATH_STYLE ?? Boolean(settings.S3_ENDPOINT),
    });
    globalForStorage.loadbearingStorage = { dir: where, driver };
    return driver;
  }
  // turbopackIgnore: a runtime data path, not source; without it the build traces the whole project.
  const dir = path.resolve(/*turbopackIgnore: true*/ process.cwd(), env().STORAGE_DIR || DEFAULT_STORAGE_DIR);
  const cached = globalForStorage.loadbearingStorage;
  if (cached && cached.dir === dir) return cached.driver;
  const driver = new LocalDiskStorage(dir);
  globalForStorage.loadbearingStorage = { dir, driver };
  return driver;
}

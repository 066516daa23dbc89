import path from 'node:path';
import { env } from '@/lib/env';
import type { Storage } from './keys';
import { LocalDiskStorage } from './local-disk';

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

/** The storage driver for this process: the local disk under STORAGE_DIR (default db/data/uploads). */
export function storage(): Storage {
  // turbopackIgnore: a runtime data path, not source; without it the build traces the whole project.
  const dir = path.resolve(/*turbopackIgnore: true*/ process.cwd(), env().STORAGE_DIR || DEFAULT_STORAGE_DIR);
  const cached = globalForStorage.loadbearingStorage;
  if (cached && cached.dir === dir) return cached.driver;
  const driver = new LocalDiskStorage(dir);
  globalForStorage.loadbearingStorage = { dir, driver };
  return driver;
}

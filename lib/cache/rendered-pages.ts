import { forgetFrontCached } from './front-cache';

/**
 * Drops a rendered page from both caches that may hold it — Next's page cache
 * (lib/cache/memory-cache-handler.mjs) and the front cache of `npm start` (front-cache.ts) — so
 * its next request renders it again from the database. Outside a production server (dev, tests)
 * there is nothing to drop.
 */
const STORE_KEY = 'loadbearingRenderedPages';

export function forgetRenderedPage(path: string): void {
  forgetFrontCached(path);
  const entries = (globalThis as Record<string, unknown>)[STORE_KEY] as Map<string, unknown> | undefined;
  if (!entries) return;
  for (const key of [...entries.keys()]) {
    if (key === path || key.endsWith(`/$${path}`)) entries.delete(key);
  }
}

/**
 * The app's side of lib/cache/memory-cache-handler.mjs: drop a rendered page so its next request
 * renders it again from the database. Outside `next start` (dev, tests) there is nothing to drop.
 */
const STORE_KEY = 'loadbearingRenderedPages';

export function forgetRenderedPage(path: string): void {
  const entries = (globalThis as Record<string, unknown>)[STORE_KEY] as Map<string, unknown> | undefined;
  if (!entries) return;
  for (const key of [...entries.keys()]) {
    if (key === path || key.endsWith(`/$${path}`)) entries.delete(key);
  }
}

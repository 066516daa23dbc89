// @ts-check
/**
 * Next's cache for rendered pages (next.config.ts `cacheHandler`), kept in this process's memory
 * so the app can drop one page the moment its content changes: publishing a verdict calls
 * forgetRenderedPage('/v/<slug>') (lib/cache/rendered-pages.ts), and revalidatePath works too.
 * Next's own handler cannot do that for Pages Router pages (its path tags only reach App Router
 * entries). Plain JavaScript because Next imports this file as it is, unbundled.
 *
 * The entries live on globalThis under one key shared with rendered-pages.ts: the server loads
 * this file outside the app's bundles.
 */

const STORE_KEY = 'loadbearingRenderedPages';
// A bound, oldest first out: a crawler asking for many slugs must not grow memory without end.
const MAX_ENTRIES = 1000;
const ERROR_PAGE = /(?:^|[/$])(?:_not-found|_error|404|500)$/;

/** @returns {Map<string, { value: unknown, lastModified: number, tags: string[], cacheControl?: unknown }>} */
function store() {
  const g = /** @type {Record<string, any>} */ (globalThis);
  return (g[STORE_KEY] ??= new Map());
}

/** Next's keys end in `/$<path>`; a plain path is accepted too. */
function keyMatchesPath(key, path) {
  return key === path || key.endsWith(`/$${path}`);
}

export default class MemoryCacheHandler {
  constructor(_options) {}

  async get(key) {
    return store().get(key) ?? null;
  }

  async set(key, data, ctx) {
    const entries = store();
    entries.delete(key);
    // An error page is never kept: rendered for one request, it carries that request's path and
    // query string (a private link's token), which the next visitor of any missing page would see.
    if (data === null || ERROR_PAGE.test(key)) return;
    if (entries.size >= MAX_ENTRIES) entries.delete(entries.keys().next().value);
    entries.set(key, {
      value: data,
      lastModified: Date.now(),
      tags: ctx?.tags ?? [],
      cacheControl: ctx?.fetchCache ? undefined : ctx?.cacheControl,
    });
  }

  /** revalidatePath(p) arrives here as the tag `_N_T_<p>`; other tags drop the entries that carry them. */
  async revalidateTag(tags) {
    const list = Array.isArray(tags) ? tags : [tags];
    const entries = store();
    for (const tag of list) {
      const path = tag.startsWith('_N_T_') ? tag.slice('_N_T_'.length) : null;
      for (const [key, entry] of entries) {
        if ((path !== null && keyMatchesPath(key, path)) || entry.tags.includes(tag)) entries.delete(key);
      }
    }
  }

  resetRequestCache() {}
}

import type { IncomingMessage, RequestListener, ServerResponse } from 'node:http';
import { gzipSync } from 'node:zlib';
import { SESSION_COOKIE } from '@/lib/auth/session';

/**
 * A cache in front of Next for the one page athletes open from shared links: a signed-out GET of
 * /v/<slug> is answered from memory, as cheaply as a static file, without entering Next's
 * request pipeline (which costs a few times a static file per request even for a cached page).
 * What it holds is exactly what Next answered for that path with no session; it is filled by
 * asking the server itself over loopback after a miss, and emptied per path by
 * forgetRenderedPage() (lib/cache/rendered-pages.ts) on publish, unpublish and delete.
 *
 * Everything else — a session cookie, a query string, another method, any other path, a 404 —
 * goes to Next untouched. One Node process: the store is on globalThis, where the routes' code
 * (bundled separately by Next) finds it to drop a page.
 */

const VERDICT_PAGE = /^\/v\/[a-z0-9-]{1,100}$/;
const SESSION = new RegExp(`(?:^|;\\s*)${SESSION_COOKIE}=`);
/** Sent by the loopback fill so it is rendered by Next, not answered from (or refilled into) this cache. */
export const FILL_HEADER = 'x-loadbearing-fill';
const MAX_ENTRIES = 1000;
/**
 * The same safety net as the page's own refresh (pages/v/[slug]/index.tsx): publishing drops a
 * page at once; a change nobody announced (a publisher's new name) shows within five minutes.
 */
export const MAX_AGE_MS = 300_000;

interface Entry {
  storedAt: number;
  body: Buffer;
  gzipped: Buffer;
  headers: Record<string, string>;
}

interface Store {
  entries: Map<string, Entry>;
  /** Bumped by every forget, so a fill that started before a publish never stores the old page. */
  generation: Map<string, number>;
  filling: Set<string>;
}

const STORE_KEY = 'loadbearingFrontCache';

export function frontCacheStore(): Store {
  const g = globalThis as Record<string, unknown>;
  return (g[STORE_KEY] ??= { entries: new Map(), generation: new Map(), filling: new Set() }) as Store;
}

/** The path this request may be answered with from the cache, or null. */
export function cacheablePath(req: IncomingMessage): string | null {
  if (req.method !== 'GET' && req.method !== 'HEAD') return null;
  if (req.headers[FILL_HEADER]) return null;
  const url = req.url ?? '';
  if (!VERDICT_PAGE.test(url)) return null; // also rules out any query string
  if (SESSION.test(req.headers.cookie ?? '')) return null;
  return url;
}

function send(req: IncomingMessage, res: ServerResponse, entry: Entry): void {
  if (req.headers['if-none-match'] && req.headers['if-none-match'] === entry.headers.etag) {
    res.writeHead(304, {
      etag: entry.headers.etag,
      'cache-control': entry.headers['cache-control'] ?? '',
      'x-loadbearing-cache': 'hit',
    });
    res.end();
    return;
  }
  const gzip = /\bgzip\b/.test(String(req.headers['accept-encoding'] ?? ''));
  const body = gzip ? entry.gzipped : entry.body;
  res.writeHead(200, {
    ...entry.headers,
    ...(gzip ? { 'content-encoding': 'gzip' } : {}),
    vary: 'Accept-Encoding',
    'content-length': String(body.length),
    'x-loadbearing-cache': 'hit',
  });
  res.end(req.method === 'HEAD' ? undefined : body);
}

// The security headers travel with the page (lib/security/headers.ts).
const KEPT_HEADERS = [
  'content-type',
  'cache-control',
  'etag',
  'content-security-policy',
  'x-content-type-options',
  'referrer-policy',
  'x-frame-options',
  'strict-transport-security',
] as const;

/** Asks the server for the page as a signed-out reader and keeps a 200 answer. */
export async function fill(path: string, origin: string): Promise<void> {
  const store = frontCacheStore();
  if (store.filling.has(path)) return;
  store.filling.add(path);
  const generation = store.generation.get(path) ?? 0;
  try {
    const res = await fetch(new URL(path, origin), {
      headers: { [FILL_HEADER]: '1', 'accept-encoding': 'identity' },
      redirect: 'manual',
    });
    const body = Buffer.from(await res.arrayBuffer());
    if (res.status !== 200) return;
    if ((store.generation.get(path) ?? 0) !== generation) return; // published meanwhile: this copy is old
    const headers: Record<string, string> = {};
    for (const name of KEPT_HEADERS) {
      const value = res.headers.get(name);
      if (value) headers[name] = value;
    }
    if (store.entries.size >= MAX_ENTRIES) store.entries.delete(store.entries.keys().next().value!);
    store.entries.set(path, { storedAt: Date.now(), body, gzipped: gzipSync(body), headers });
  } catch (error) {
    // Only the cache suffers: the next request is rendered by Next and tries again.
    console.warn(`front cache: could not fill ${path}:`, error instanceof Error ? error.message : error);
  } finally {
    store.filling.delete(path);
  }
}

/** Drops one path; the next signed-out request goes to Next and refills it. */
export function forgetFrontCached(path: string): void {
  const store = (globalThis as Record<string, unknown>)[STORE_KEY] as Store | undefined;
  if (!store) return;
  store.entries.delete(path);
  store.generation.set(path, (store.generation.get(path) ?? 0) + 1);
}

/**
 * Wraps Next's request handler: cached verdict pages are answered here, everything else (and a
 * miss, which then fills the cache in the background) is Next's.
 */
export function withFrontCache(
  handle: (req: IncomingMessage, res: ServerResponse) => unknown,
  origin: () => string,
  { maxAgeMs = MAX_AGE_MS } = {},
): RequestListener {
  return (req, res) => {
    const path = cacheablePath(req);
    if (path) {
      const entry = frontCacheStore().entries.get(path);
      if (entry && Date.now() - entry.storedAt < maxAgeMs) return send(req, res, entry);
      void fill(path, origin());
    }
    return handle(req, res);
  };
}

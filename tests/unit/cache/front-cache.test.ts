import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '@/lib/auth/session';
import { FILL_HEADER, frontCacheStore, withFrontCache } from '@/lib/cache/front-cache';
import { forgetRenderedPage } from '@/lib/cache/rendered-pages';

// A stand-in for Next's handler: counts what reaches it and answers with the current "version".
let version = 1;
let reached: string[] = [];
function fakeNext(req: IncomingMessage, res: ServerResponse) {
  reached.push(`${req.method} ${req.url}${req.headers[FILL_HEADER] ? ' (fill)' : ''}`);
  if (req.url === '/v/missing') {
    res.writeHead(404, { 'content-type': 'text/html' }).end('<p>not found</p>');
    return;
  }
  res
    .writeHead(200, {
      'content-type': 'text/html; charset=utf-8',
      'cache-control': 's-maxage=300',
      etag: `"v${version}"`,
    })
    .end(`<p>verdict version ${version}</p>`);
}

let server: Server;
let origin = '';
beforeAll(async () => {
  server = createServer(withFrontCache(fakeNext, () => origin));
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));
beforeEach(() => {
  frontCacheStore().entries.clear();
  reached = [];
  version = 1;
});

const get = (path: string, headers: Record<string, string> = {}) =>
  fetch(origin + path, { headers: { 'accept-encoding': 'identity', ...headers } });
/** The background fill is a loopback request; wait until the entry is there. */
async function cached(path: string) {
  await expect.poll(() => frontCacheStore().entries.has(path)).toBe(true);
}

describe('the front cache of the verdict pages', () => {
  it('a miss goes to Next and fills the cache; the next signed-out request never reaches Next', async () => {
    const first = await get('/v/cold-plunges');
    expect(await first.text()).toBe('<p>verdict version 1</p>');
    expect(first.headers.get('x-loadbearing-cache')).toBeNull();
    await cached('/v/cold-plunges');
    reached = [];
    const second = await get('/v/cold-plunges');
    expect(second.headers.get('x-loadbearing-cache')).toBe('hit');
    expect(second.headers.get('content-type')).toBe('text/html; charset=utf-8');
    expect(second.headers.get('cache-control')).toBe('s-maxage=300');
    expect(await second.text()).toBe('<p>verdict version 1</p>');
    expect(reached).toEqual([]);
  });

  it('sends gzip to a browser that accepts it, headers only to HEAD, and 304 for a matching ETag', async () => {
    await get('/v/cold-plunges');
    await cached('/v/cold-plunges');
    const zipped = await fetch(origin + '/v/cold-plunges', { headers: { 'accept-encoding': 'gzip' } });
    expect(zipped.headers.get('content-encoding')).toBe('gzip');
    expect(zipped.headers.get('vary')).toBe('Accept-Encoding');
    // fetch un-gzips on its own; the raw bytes were checked by the header above.
    expect(await zipped.text()).toBe('<p>verdict version 1</p>');
    expect(gunzipSync(frontCacheStore().entries.get('/v/cold-plunges')!.gzipped).toString()).toBe(
      '<p>verdict version 1</p>',
    );
    const head = await fetch(origin + '/v/cold-plunges', { method: 'HEAD' });
    expect(head.status).toBe(200);
    expect(await head.text()).toBe('');
    const notModified = await get('/v/cold-plunges', { 'if-none-match': '"v1"' });
    expect(notModified.status).toBe(304);
  });

  it('forgetRenderedPage (publish, unpublish, delete) drops the page: the next request sees the new version', async () => {
    await get('/v/cold-plunges');
    await cached('/v/cold-plunges');
    version = 2;
    forgetRenderedPage('/v/cold-plunges');
    expect(await (await get('/v/cold-plunges')).text()).toBe('<p>verdict version 2</p>');
    await cached('/v/cold-plunges');
    expect(await (await get('/v/cold-plunges')).text()).toBe('<p>verdict version 2</p>');
  });

  it('never answers for a session, a query string, another method, another path or a 404', async () => {
    await get('/v/cold-plunges');
    await cached('/v/cold-plunges');
    reached = [];
    await get('/v/cold-plunges', { cookie: `theme=dark; ${SESSION_COOKIE}=sealed` });
    await get('/v/cold-plunges?utm_source=mail');
    await fetch(origin + '/v/cold-plunges', { method: 'POST' });
    await get('/v/cold-plunges/versions');
    expect(reached).toEqual([
      'GET /v/cold-plunges',
      'GET /v/cold-plunges?utm_source=mail',
      'POST /v/cold-plunges',
      'GET /v/cold-plunges/versions',
    ]);
    expect((await get('/v/missing')).status).toBe(404);
    await new Promise((r) => setTimeout(r, 100)); // let the fill of /v/missing finish
    expect(frontCacheStore().entries.has('/v/missing')).toBe(false);
    expect((await get('/v/missing')).status).toBe(404);
  });

  it('a fill that started before a publish does not store the old page', async () => {
    // Hold the fill's answer until the page has been dropped.
    let release!: () => void;
    const held = new Promise<void>((r) => (release = r));
    let slowOrigin = '';
    const slowNext = async (req: IncomingMessage, res: ServerResponse) => {
      if (req.headers[FILL_HEADER]) await held;
      res.writeHead(200, { 'content-type': 'text/html' }).end('<p>old</p>');
    };
    const slowServer: Server = createServer(withFrontCache(slowNext, () => slowOrigin));
    await new Promise<void>((resolve) => slowServer.listen(0, '127.0.0.1', resolve));
    slowOrigin = `http://127.0.0.1:${(slowServer.address() as AddressInfo).port}`;
    await fetch(slowOrigin + '/v/racing');
    forgetRenderedPage('/v/racing');
    release();
    await new Promise((r) => setTimeout(r, 100));
    expect(frontCacheStore().entries.has('/v/racing')).toBe(false);
    await new Promise<void>((resolve) => slowServer.close(() => resolve()));
  });

  it('an entry older than its maximum age goes back to Next and is filled again', async () => {
    let answers = 0;
    let shortOrigin = '';
    const short: Server = createServer(
      withFrontCache(
        (_req, res) => {
          answers++;
          res.writeHead(200, { 'content-type': 'text/html' }).end(`<p>answer ${answers}</p>`);
        },
        () => shortOrigin,
        { maxAgeMs: 200 },
      ),
    );
    await new Promise<void>((resolve) => short.listen(0, '127.0.0.1', resolve));
    shortOrigin = `http://127.0.0.1:${(short.address() as AddressInfo).port}`;
    await fetch(shortOrigin + '/v/aging');
    await cached('/v/aging');
    const fresh = await fetch(shortOrigin + '/v/aging');
    expect(fresh.headers.get('x-loadbearing-cache')).toBe('hit');
    await new Promise((r) => setTimeout(r, 250));
    const aged = await fetch(shortOrigin + '/v/aging');
    expect(aged.headers.get('x-loadbearing-cache')).toBeNull();
    await new Promise<void>((resolve) => short.close(() => resolve()));
  });
});

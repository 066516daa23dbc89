import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { BlockList } from 'node:net';
import { errorResponse } from '../lib/api/respond';
import { waitsAtTheDoor, withDoorPlace, writeDoor } from '../lib/api/write-turns';
import { resolveClientAddress } from '../lib/auth/client-address';
import { STRICT_POLICY, staticSecurityHeaders } from '../lib/security/headers';
import type { WriteQueue } from '../lib/write-queue';

/**
 * How long `npm start` keeps an idle connection open: longer than the proxy keeps its idle
 * connections to the app (deploy/nginx/loadbearing.conf, `keepalive_timeout` in the upstream
 * block, 60 s), so the proxy always closes first. With Node's default of 5 s the app closed
 * connections the proxy still counted as open; a request the proxy sent on one as it closed got
 * a 502, and nginx does not try a POST or PATCH again on another connection (the
 * `non_idempotent` case of proxy_next_upstream). Seen once in about 8,000 autosaves through
 * the proxy (bench/several-processes.ts).
 */
export const KEEP_ALIVE_TIMEOUT_MS = 65_000;

type Handle = (req: IncomingMessage, res: ServerResponse) => unknown;

/**
 * The server of `npm start` around Next's request handler. Two jobs before Next sees a request:
 * decide the client's address from the socket and the trusted proxies (lib/auth/client-address.ts)
 * before the app reads it, and let only a few writes into Next at once (`door`, by default the
 * process's own, lib/api/write-turns.ts); a write that waits there too long answers 503 with
 * Retry-After, as the route wrapper's turns do.
 */
export function createAppServer(handle: Handle, proxies: BlockList, door: WriteQueue = writeDoor()): Server {
  const server = createServer((req, res) => {
    // The one x-forwarded-for the app reads: the socket's address, or a trusted proxy's word for it.
    req.headers['x-forwarded-for'] = resolveClientAddress(
      req.socket.remoteAddress,
      req.headers['x-forwarded-for'],
      proxies,
    );
    delete req.headers['x-real-ip'];
    if (!waitsAtTheDoor(req.method, req.headers['content-type'])) return handle(req, res);
    return throughTheDoor(door, req, res, handle);
  });
  server.keepAliveTimeout = KEEP_ALIVE_TIMEOUT_MS;
  // Above the keep-alive time, so a kept connection's next request is not cut by the header
  // timer (common practice for servers behind a proxy).
  server.headersTimeout = KEEP_ALIVE_TIMEOUT_MS + 1000;
  return server;
}

/** Hands the request to Next once the door lets it in; its place is given up when its answer ends. */
function throughTheDoor(door: WriteQueue, req: IncomingMessage, res: ServerResponse, handle: Handle): void {
  // 'close' comes once the answer is sent or the client went away, also while still waiting.
  const closed = new AbortController();
  res.once('close', () => closed.abort());
  door.acquire(closed.signal).then(
    (release) => {
      res.once('close', release);
      if (closed.signal.aborted) return release();
      return withDoorPlace(release, () => handle(req, res));
    },
    (error) => {
      if (!closed.signal.aborted) void sendAnswer(res, errorResponse(error));
    },
  );
}

/** A web Response written to Node's response, with the headers every answer carries (next.config.ts). */
async function sendAnswer(res: ServerResponse, answer: Response): Promise<void> {
  const body = await answer.text();
  if (res.headersSent || res.destroyed) return;
  res.statusCode = answer.status;
  answer.headers.forEach((value, key) => res.setHeader(key, value));
  for (const { key, value } of staticSecurityHeaders()) res.setHeader(key, value);
  res.setHeader('Content-Security-Policy', STRICT_POLICY);
  res.end(body);
}

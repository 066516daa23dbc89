import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { BlockList } from 'node:net';
import { resolveClientAddress } from '../lib/auth/client-address';

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

/**
 * The server of `npm start` around Next's request handler: its one job is to decide the client's
 * address from the socket and the trusted proxies (lib/auth/client-address.ts) before the app
 * reads it.
 */
export function createAppServer(
  handle: (req: IncomingMessage, res: ServerResponse) => unknown,
  proxies: BlockList,
): Server {
  const server = createServer((req, res) => {
    // The one x-forwarded-for the app reads: the socket's address, or a trusted proxy's word for it.
    req.headers['x-forwarded-for'] = resolveClientAddress(
      req.socket.remoteAddress,
      req.headers['x-forwarded-for'],
      proxies,
    );
    delete req.headers['x-real-ip'];
    return handle(req, res);
  });
  server.keepAliveTimeout = KEEP_ALIVE_TIMEOUT_MS;
  // Above the keep-alive time, so a kept connection's next request is not cut by the header
  // timer (common practice for servers behind a proxy).
  server.headersTimeout = KEEP_ALIVE_TIMEOUT_MS + 1000;
  return server;
}

import { createServer } from 'node:http';
import { resolveClientAddress, trustedProxies } from '../lib/auth/client-address';
import { withFrontCache } from '../lib/cache/front-cache';
import { env } from '../lib/env';
import { loadLocalEnv, migrateDatabase } from './boot';

/**
 * `npm start`: the production server on a built app. Migrates first (never seeds demo data), then
 * serves Next's request handler behind the verdict pages' front cache (lib/cache/front-cache.ts)
 * in this one process. PORT (default 3000) and HOST (default: all interfaces). Not HOSTNAME:
 * containers set that to their own name.
 */
async function main() {
  loadLocalEnv();
  await migrateDatabase({ seedDemo: false });
  const port = Number(process.env.PORT ?? 3000);
  const hostname = process.env.HOST || undefined;

  const { default: next } = await import('next');
  const app = next({ dev: false, dir: process.cwd(), hostname: hostname ?? 'localhost', port });
  await app.prepare();
  const origin = `http://${hostname && hostname !== '0.0.0.0' ? hostname : '127.0.0.1'}:${port}`;
  const handle = withFrontCache(app.getRequestHandler(), () => origin);
  // The one x-forwarded-for the app reads: the socket's address, or a trusted proxy's word for it.
  const proxies = trustedProxies(env().TRUSTED_PROXIES);
  const server = createServer((req, res) => {
    req.headers['x-forwarded-for'] = resolveClientAddress(
      req.socket.remoteAddress,
      req.headers['x-forwarded-for'],
      proxies,
    );
    delete req.headers['x-real-ip'];
    return handle(req, res);
  });
  server.listen(port, hostname, () => console.log(`Loadbearing (production) listening on ${origin}`));

  const stop = () => {
    server.close(() => process.exit(0));
    server.closeAllConnections();
  };
  for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, stop);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

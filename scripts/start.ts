import { createServer } from 'node:http';
import { resolveClientAddress, trustedProxies } from '../lib/auth/client-address';
import { env } from '../lib/env';
import { loadLocalEnv, migrateDatabase, refusePendingMigrations } from './boot';

/**
 * `npm start`: the production server on a built app — Next's request handler in a small custom
 * server (https://nextjs.org/docs/app/guides/custom-server) whose one job is to decide the
 * client's address from the socket and TRUSTED_PROXIES (lib/auth/client-address.ts) before the
 * app reads it. PORT (default 3000) and HOST (default: all interfaces); not HOSTNAME: containers
 * set that to their own name. Caching is the framework's and the proxy's (docs/deployment.md).
 *
 * Before it, the database: on SQLite (one process, the embedded default) it migrates under the
 * migration lock and never seeds; on PostgreSQL (several processes, docs/deployment.md) it does
 * not migrate at all — `npm run db:migrate` is the deployment's own step — and refuses to start
 * on a database with migrations pending, so no two processes race to change the schema.
 */
async function main() {
  loadLocalEnv();
  const { databaseDialect } = await import('../lib/db');
  if (databaseDialect() === 'postgres') await refusePendingMigrations();
  else await migrateDatabase({ seedDemo: false });

  const port = Number(process.env.PORT ?? 3000);
  const hostname = process.env.HOST || undefined;
  const { default: next } = await import('next');
  const app = next({ dev: false, dir: process.cwd(), hostname: hostname ?? 'localhost', port });
  await app.prepare();
  const handle = app.getRequestHandler();
  const origin = `http://${hostname && hostname !== '0.0.0.0' ? hostname : '127.0.0.1'}:${port}`;
  // The one x-forwarded-for the app reads: the socket's address, or a trusted proxy's word for it.
  const proxies = trustedProxies(env().TRUSTED_PROXIES);
  const server = createServer((req, res) => {
    req.headers['x-forwarded-for'] = resolveClientAddress(req.socket.remoteAddress, req.headers['x-forwarded-for'], proxies);
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
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});

import { trustedProxies } from '../lib/auth/client-address';
import { env } from '../lib/env';
import { createAppServer } from './app-server';
import { loadLocalEnv, migrateDatabase, refusePendingMigrations } from './boot';

/**
 * `npm start`: the production server on a built app — Next's request handler in a small custom
 * server (https://nextjs.org/docs/app/guides/custom-server, scripts/app-server.ts) that decides
 * the client's address from the socket and TRUSTED_PROXIES before the app reads it, and lets
 * only a few write requests into Next at once (lib/api/write-turns.ts). PORT (default 3000) and
 * HOST (default: all interfaces); not HOSTNAME: containers set that to their own name. Caching
 * is the framework's and the proxy's (docs/deployment.md).
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
  const server = createAppServer(handle, trustedProxies(env().TRUSTED_PROXIES));
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

import { spawn } from 'node:child_process';
import path from 'node:path';
import { loadLocalEnv, migrateDatabase, refusePendingMigrations } from './boot';

/**
 * `npm start`: Next's own production server (`next start`) on a built app. PORT (default 3000)
 * and HOST (default: all interfaces); not HOSTNAME: containers set that to their own name.
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

  const args = ['start', '--port', String(process.env.PORT ?? 3000)];
  if (process.env.HOST) args.push('--hostname', process.env.HOST);
  const next = spawn(process.execPath, [path.join(process.cwd(), 'node_modules/next/dist/bin/next'), ...args], {
    stdio: 'inherit',
    env: { ...process.env, NODE_ENV: 'production' },
  });
  for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => next.kill(signal));
  next.on('exit', (code, signal) => process.exit(code ?? (signal ? 0 : 1)));
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});

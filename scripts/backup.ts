import path from 'node:path';
import { backupFileName, backupPostgres, backupSqlite } from '../lib/backup/backup';
import { databaseDialect, databaseFile } from '../lib/db';
import { loadLocalEnv } from './boot';

/**
 * `npm run db:backup [target file]`: an online, consistent copy of the database while the app
 * runs (lib/backup/backup.ts); default target db/data/backups/loadbearing-<time>.sqlite (or
 * .dump on PostgreSQL). Restoring is in docs/deployment.md.
 */
async function main() {
  loadLocalEnv();
  const url = process.env.DATABASE_URL;
  const postgres = databaseDialect(url) === 'postgres';
  const target = path.resolve(
    process.argv[2] ?? path.join('db/data/backups', backupFileName(new Date(), postgres ? 'dump' : 'sqlite')),
  );
  if (postgres) await backupPostgres(url!, target);
  else await backupSqlite(databaseFile(url), target);
  console.log(`Backed up to ${target}`);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync, appendFileSync } from 'node:fs';
import path from 'node:path';

/**
 * Everything the app needs before Next starts, shared by `npm run dev` and `npm start`:
 * a session secret, the environment from .env.local, and a migrated database.
 */

const LOCAL_ENV = path.resolve(process.cwd(), '.env.local');

/** Development only: writes a random SESSION_SECRET into .env.local once, never into code or git. */
export function ensureLocalSecret(): void {
  if (process.env.SESSION_SECRET) return;
  const current = existsSync(LOCAL_ENV) ? readFileSync(LOCAL_ENV, 'utf8') : '';
  if (/^SESSION_SECRET=/m.test(current)) return;
  const secret = randomBytes(32).toString('base64url');
  appendFileSync(LOCAL_ENV, `${current && !current.endsWith('\n') ? '\n' : ''}SESSION_SECRET=${secret}\n`);
  console.log('Generated a development SESSION_SECRET in .env.local');
}

export function loadLocalEnv(): void {
  for (const file of ['.env', '.env.local']) {
    const full = path.resolve(process.cwd(), file);
    if (existsSync(full)) process.loadEnvFile(full);
  }
}

export async function migrateDatabase({ seedDemo }: { seedDemo: boolean }): Promise<void> {
  const { db, databaseLabel, closeDb } = await import('../lib/db');
  const { migrate, seed } = await import('../db/migrate');
  const applied = await migrate(db());
  if (applied.length) console.log(`Migrated ${databaseLabel()}: ${applied.join(', ')}`);
  if (seedDemo) {
    const seeded = await seed(db());
    if (seeded.length) console.log(`Seeded the demo team: ${seeded.join(', ')}`);
  }
  await closeDb();
}

/** For app processes that must not migrate (PostgreSQL): stop with a clear sentence if the schema is behind. */
export async function refusePendingMigrations(): Promise<void> {
  const { db, databaseLabel, closeDb } = await import('../lib/db');
  const { pendingMigrations } = await import('../db/migrate');
  const pending = await pendingMigrations(db());
  await closeDb();
  if (pending.length) {
    throw new Error(
      `The database ${databaseLabel()} has ${pending.length} migration(s) pending (${pending.join(', ')}). ` +
        'Run `npm run db:migrate` once, then start the app processes (docs/deployment.md).',
    );
  }
}

export async function printDemoSignIns(url: string): Promise<void> {
  const { DEMO_ACCOUNTS, DEMO_PASSWORD } = await import('../db/seeders/demo-accounts');
  const width = Math.max(...DEMO_ACCOUNTS.map((a) => a.email.length));
  console.log(`\nLoadbearing is running at ${url}\n\nDemo sign-ins (password: ${DEMO_PASSWORD}):`);
  for (const a of DEMO_ACCOUNTS) console.log(`  ${a.email.padEnd(width)}  ${a.role.padEnd(8)}  ${a.name}, ${a.title}`);
  console.log('');
}

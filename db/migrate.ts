import { SequelizeStorage, Umzug } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';
import { withMigrationLock } from './migration-lock';
import { env, isProduction } from '../lib/env';
import { migrations } from './migrations';
import { seeders } from './seeders';

function migrator(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations,
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/**
 * Applies every pending migration under the migration lock (db/migration-lock.ts), so several
 * processes starting at once apply each migration once; returns the names it applied.
 */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  if (sequelize.getDialect() === 'sqlite') await sequelize.query('PRAGMA journal_mode=WAL');
  const applied = await withMigrationLock(sequelize, () => migrator(sequelize).up());
  return applied.map((m) => m.name);
}

export async function pendingMigrations(sequelize: Sequelize): Promise<string[]> {
  return (await migrator(sequelize).pending()).map((m) => m.name);
}

/**
 * Runs the demo seeders that have not run yet (recorded like migrations, so a restart never
 * duplicates the demo team). Refuses in production: the demo password is public.
 */
export async function seed(sequelize: Sequelize): Promise<string[]> {
  if (isProduction() && env().ALLOW_DEMO_SEED !== '1') {
    throw new Error('Refusing to seed demo data in production (set ALLOW_DEMO_SEED=1 for a demo host).');
  }
  const umzug = new Umzug<Sequelize>({
    migrations: seeders,
    context: sequelize,
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_seeds' }),
    logger: undefined,
  });
  return (await withMigrationLock(sequelize, () => umzug.up())).map((s) => s.name);
}

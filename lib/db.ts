import path from 'node:path';
import { Sequelize } from 'sequelize';
import sqlite3 from 'sqlite3';
import { serialiseWrites } from './sqlite-writer';
import { env } from '@/lib/env';

/** Where the SQLite file lives unless DATABASE_URL says otherwise. */
export const DEFAULT_DATABASE_FILE = 'db/data/loadbearing.sqlite';

/** The two engines: SQLite embedded (the default), PostgreSQL for several processes (docs/deployment.md). */
export type Dialect = 'sqlite' | 'postgres';

/** `postgres://…` or `postgresql://…` selects PostgreSQL; anything else (a SQLite path or URL) keeps SQLite. */
export function databaseDialect(url = env().DATABASE_URL): Dialect {
  return url && /^postgres(ql)?:\/\//i.test(url) ? 'postgres' : 'sqlite';
}

export const isPostgres = () => databaseDialect() === 'postgres';

/** Accepts `sqlite:path`, `file:path`, a plain path, or `:memory:`. */
export function databaseFile(url = env().DATABASE_URL): string {
  // turbopackIgnore: a runtime data path, not source; without it the build traces the whole project.
  if (!url) return path.resolve(/*turbopackIgnore: true*/ process.cwd(), DEFAULT_DATABASE_FILE);
  const stripped = url.replace(/^(sqlite|file):(\/\/)?/, '');
  return stripped === ':memory:' ? stripped : path.resolve(/*turbopackIgnore: true*/ process.cwd(), stripped);
}

/** What to print about the database in logs: the SQLite file, or the PostgreSQL URL without its password. */
export function databaseLabel(url = env().DATABASE_URL): string {
  if (databaseDialect(url) === 'sqlite') return databaseFile(url);
  const parsed = new URL(url!);
  parsed.password = parsed.password ? '***' : '';
  return parsed.toString();
}

/**
 * Every connection Sequelize opens (it opens one per transaction) gets a busy timeout, so a
 * writer from another process (a script) is waited for instead of failing with SQLITE_BUSY, and
 * WAL so readers never block the writer. Writers of this process queue in lib/sqlite-writer.ts.
 */
class TunedDatabase extends sqlite3.Database {
  constructor(filename: string, mode?: number, callback?: (err: Error | null) => void) {
    super(filename, mode ?? sqlite3.OPEN_READWRITE | sqlite3.OPEN_CREATE, (err) => {
      if (!err) {
        this.configure('busyTimeout', 5000);
        if (filename !== ':memory:') this.exec('PRAGMA journal_mode=WAL');
      }
      callback?.(err);
    });
  }
}

const dialectModule = { ...sqlite3, Database: TunedDatabase };

function openSqlite(): Sequelize {
  return new Sequelize({
    dialect: 'sqlite',
    storage: databaseFile(),
    dialectModule,
    logging: false,
    define: { underscored: false },
    // Writers queue in the process (lib/sqlite-writer.ts); SQLITE_BUSY now only comes from
    // another process after the busy timeout, and retrying it would hold the request longer.
    retry: { max: 1 },
  });
}

/**
 * PostgreSQL through Sequelize's own dialect (the `pg` driver). The pool is sized for one app
 * process of several behind the proxy; PG_POOL_MAX raises it.
 */
function openPostgres(url: string): Sequelize {
  return new Sequelize(url, {
    dialect: 'postgres',
    logging: false,
    define: { underscored: false },
    pool: { max: env().PG_POOL_MAX, min: 0, idle: 10_000, acquire: 30_000 },
  });
}

const globalForDb = globalThis as unknown as { loadbearingDb?: Sequelize };

/** The one Sequelize connection of the process (kept on globalThis so hot reloads reuse it). */
export function db(): Sequelize {
  if (!globalForDb.loadbearingDb) {
    const url = env().DATABASE_URL;
    globalForDb.loadbearingDb = databaseDialect(url) === 'postgres' ? openPostgres(url!) : serialiseWrites(openSqlite());
  }
  return globalForDb.loadbearingDb;
}

/**
 * Closes the connection and forgets it, so the next db() opens a fresh one. For a process that
 * migrates and then serves (`npm start` runs Next in the same process, on the same globalThis).
 */
export async function closeDb(): Promise<void> {
  const open = globalForDb.loadbearingDb;
  globalForDb.loadbearingDb = undefined;
  await open?.close();
}

import path from 'node:path';
import { Sequelize } from 'sequelize';
import sqlite3 from 'sqlite3';
import { env } from '@/lib/env';

/** Where the SQLite file lives unless DATABASE_URL says otherwise. */
export const DEFAULT_DATABASE_FILE = 'db/data/loadbearing.sqlite';

/** Accepts `sqlite:path`, `file:path`, a plain path, or `:memory:`. */
export function databaseFile(url = env().DATABASE_URL): string {
  // turbopackIgnore: a runtime data path, not source; without it the build traces the whole project.
  if (!url) return path.resolve(/*turbopackIgnore: true*/ process.cwd(), DEFAULT_DATABASE_FILE);
  const stripped = url.replace(/^(sqlite|file):(\/\/)?/, '');
  return stripped === ':memory:' ? stripped : path.resolve(/*turbopackIgnore: true*/ process.cwd(), stripped);
}

/**
 * Every connection Sequelize opens (it opens one per transaction) gets a busy timeout, so a
 * writer waits for another instead of failing with SQLITE_BUSY, and WAL so readers never block
 * writers.
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

const globalForDb = globalThis as unknown as { loadbearingDb?: Sequelize };

/** The one Sequelize connection of the process (kept on globalThis so hot reloads reuse it). */
export function db(): Sequelize {
  if (!globalForDb.loadbearingDb) {
    globalForDb.loadbearingDb = new Sequelize({
      dialect: 'sqlite',
      storage: databaseFile(),
      dialectModule,
      logging: false,
      define: { underscored: false },
    });
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

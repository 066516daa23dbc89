import { spawn } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import sqlite3 from 'sqlite3';

/**
 * Online backups (docs/deployment.md, "Backup and restore"). SQLite: `VACUUM INTO` on a
 * connection of its own, which reads inside one transaction, so the copy is the database as it
 * was at one moment (every write committed before it began, none half-done) while the app goes
 * on writing; the copy is a plain, compact SQLite file. PostgreSQL: `pg_dump`, which does the same
 * through a snapshot, in its custom format for `pg_restore`.
 */

export function backupFileName(now = new Date(), extension = 'sqlite'): string {
  return `loadbearing-${now.toISOString().replace(/[:.]/g, '-')}.${extension}`;
}

export async function backupSqlite(databaseFile: string, target: string): Promise<void> {
  mkdirSync(path.dirname(target), { recursive: true });
  const source = await new Promise<sqlite3.Database>((resolve, reject) => {
    const opened: sqlite3.Database = new sqlite3.Database(databaseFile, sqlite3.OPEN_READONLY, (error) =>
      error ? reject(error) : resolve(opened),
    );
  });
  try {
    source.configure('busyTimeout', 30_000);
    await new Promise<void>((resolve, reject) =>
      source.run('VACUUM INTO ?', [target], (error) => (error ? reject(error) : resolve())),
    );
  } finally {
    await new Promise<void>((resolve) => source.close(() => resolve()));
  }
}

/** Runs pg_dump (Debian: package postgresql-client) for the database URL into `target`. */
export function backupPostgres(url: string, target: string, pgDump = 'pg_dump'): Promise<void> {
  mkdirSync(path.dirname(target), { recursive: true });
  return new Promise((resolve, reject) => {
    const child = spawn(pgDump, ['--format=custom', '--no-owner', `--file=${target}`, `--dbname=${url}`], {
      stdio: ['ignore', 'inherit', 'inherit'],
    });
    child.on('error', (error) => reject(new Error(`Could not run ${pgDump}: ${error.message}`)));
    child.on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`${pgDump} exited with ${code}`))));
  });
}

import sqlite3 from 'sqlite3';
import type { Sequelize } from 'sequelize';

/**
 * One migrator at a time, whichever process gets there first; the others wait and then find
 * nothing left to apply (docs/deployment.md, "Migrations").
 *
 * PostgreSQL: a session-level advisory lock (pg_advisory_lock) held by one pooled connection for
 * the whole run; it is released on unlock or when that session ends, so a killed migrator never
 * leaves it behind. SQLite: an exclusive transaction on a small side file next to the database,
 * waited on through SQLite's busy timeout and released by the operating system if the process
 * dies.
 */

/** Any fixed 64-bit number, the same in every process: this one spells "lbmigrat" in ASCII. */
const ADVISORY_KEY = '7809640187163357556';
const WAIT_MS = 10 * 60_000;

export async function withMigrationLock<T>(sequelize: Sequelize, work: () => Promise<T>): Promise<T> {
  return sequelize.getDialect() === 'postgres' ? withAdvisoryLock(sequelize, work) : withSqliteLock(sequelize, work);
}

async function withAdvisoryLock<T>(sequelize: Sequelize, work: () => Promise<T>): Promise<T> {
  const pool = sequelize.connectionManager as unknown as {
    getConnection(opts?: object): Promise<{ query(sql: string): Promise<unknown> }>;
    releaseConnection(connection: unknown): Promise<void>;
  };
  const connection = await pool.getConnection();
  try {
    await connection.query(`SELECT pg_advisory_lock(${ADVISORY_KEY})`);
    try {
      return await work();
    } finally {
      await connection.query(`SELECT pg_advisory_unlock(${ADVISORY_KEY})`);
    }
  } finally {
    await pool.releaseConnection(connection);
  }
}

function run(database: sqlite3.Database, sql: string): Promise<void> {
  return new Promise((resolve, reject) => database.exec(sql, (error) => (error ? reject(error) : resolve())));
}

async function withSqliteLock<T>(sequelize: Sequelize, work: () => Promise<T>): Promise<T> {
  const storage = (sequelize as unknown as { options: { storage?: string } }).options.storage ?? ':memory:';
  if (storage === ':memory:') return work(); // one connection, one process: nobody to wait for
  const database = await new Promise<sqlite3.Database>((resolve, reject) => {
    const opened: sqlite3.Database = new sqlite3.Database(`${storage}.migrate-lock`, (error) =>
      error ? reject(error) : resolve(opened),
    );
  });
  try {
    database.configure('busyTimeout', WAIT_MS);
    await run(database, 'BEGIN EXCLUSIVE');
    try {
      return await work();
    } finally {
      await run(database, 'ROLLBACK');
    }
  } finally {
    await new Promise<void>((resolve) => database.close(() => resolve()));
  }
}

import { Transaction, UniqueConstraintError } from 'sequelize';
import { conflict } from '@/lib/api/errors';
import { db } from '@/lib/db';

/** Any fixed number, the same in every process ("lbwrite" in ASCII); distinct from the migration lock's. */
const WRITE_LOCK_KEY = '30772361716758901';

/**
 * A write transaction that takes SQLite's write lock at BEGIN (BEGIN IMMEDIATE). The workbench
 * reads, checks, then writes (is the study already appraised? is the slug free?); in a deferred
 * transaction two such writers can both read and then one fails to upgrade its lock with
 * SQLITE_BUSY. Taken up front, the second simply waits (busy timeout, lib/db.ts) and then sees
 * the first one's rows.
 *
 * PostgreSQL has no BEGIN IMMEDIATE: the same one-writer-at-a-time is a transaction-scoped
 * advisory lock taken first (released at COMMIT or ROLLBACK), so both engines behave alike for
 * every process that shares the database.
 */
export function writeTransaction<T>(run: (transaction: Transaction) => Promise<T>): Promise<T> {
  return db().transaction({ type: Transaction.TYPES.IMMEDIATE }, async (transaction) => {
    if (db().getDialect() === 'postgres') {
      await db().query(`SELECT pg_advisory_xact_lock(${WRITE_LOCK_KEY})`, { transaction });
    }
    return run(transaction);
  });
}

/**
 * A unique index that still trips (a concurrent writer outside these transactions) becomes a
 * 409 with a sentence instead of a 500.
 */
export async function uniqueOrConflict<T>(message: string, run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw conflict(message);
    throw error;
  }
}

import { Transaction, UniqueConstraintError } from 'sequelize';
import { conflict } from '@/lib/api/errors';
import { db } from '@/lib/db';

/** Any fixed number, the same in every process ("lbwrite" in ASCII); distinct from the migration lock's. */
const WRITE_LOCK_KEY = '30772361716758901';
/** The first half of a review's own lock ("lbrv"); the review's id is the second (two-int4 key space). */
const REVIEW_LOCK_SPACE = 1818391158;
/** The first half of a named lock ("lbky"); hashtext(name) is the second. */
const KEY_LOCK_SPACE = 1818393465;

/** What a write transaction may touch, so PostgreSQL can let unrelated writers run side by side. */
export interface WriteScope {
  /**
   * Every row the transaction reads to decide, and every row it writes, belongs to this review
   * (its mechanisms, appraisals, cached verdict, audit events): writers of other reviews need not
   * wait for it.
   */
  reviewId?: number;
  /**
   * Or: every row it reads to decide and writes is named by these keys (the sign-in throttle's
   * rows): writers of other keys need not wait for it.
   */
  keys?: string[];
}

/**
 * A write transaction that takes SQLite's write lock at BEGIN (BEGIN IMMEDIATE). The workbench
 * reads, checks, then writes (is the study already appraised? is the slug free?); in a deferred
 * transaction two such writers can both read and then one fails to upgrade its lock with
 * SQLITE_BUSY. Taken up front, the second simply waits (lib/sqlite-writer.ts queues the
 * process's writers) and then sees the first one's rows.
 *
 * PostgreSQL has no BEGIN IMMEDIATE: the same one-writer-at-a-time is a transaction-scoped
 * advisory lock taken first (released at COMMIT or ROLLBACK), so both engines behave alike for
 * every process that shares the database. A transaction scoped to one review takes that lock
 * shared plus an exclusive lock of its review, in one statement: writers of one review still go
 * one at a time, writers of different reviews (different coaches autosaving) no longer wait for
 * each other, and an unscoped writer (a library change, a team change) still excludes them all.
 * A transaction scoped to keys (the sign-in throttle's rows of one address and one e-mail) does
 * the same with a lock per key.
 * See https://www.postgresql.org/docs/current/explicit-locking.html#ADVISORY-LOCKS.
 */
export function writeTransaction<T>(run: (transaction: Transaction) => Promise<T>, scope: WriteScope = {}): Promise<T> {
  return db().transaction({ type: Transaction.TYPES.IMMEDIATE }, async (transaction) => {
    if (db().getDialect() === 'postgres') {
      const { query, values } = lockStatement(scope);
      await db().query(query, { transaction, bind: values });
    }
    return run(transaction);
  });
}

/** The one statement that takes a write transaction's advisory locks (in a fixed order: no deadlock). */
function lockStatement(scope: WriteScope): { query: string; values: unknown[] } {
  const shared = `pg_advisory_xact_lock_shared(${WRITE_LOCK_KEY})`;
  if (scope.reviewId !== undefined) {
    return {
      query: `SELECT ${shared}, pg_advisory_xact_lock(${REVIEW_LOCK_SPACE}, ${reviewLockKey(scope.reviewId)})`,
      values: [],
    };
  }
  if (scope.keys?.length) {
    const keys = [...new Set(scope.keys)].sort();
    const each = keys.map((_, i) => `pg_advisory_xact_lock(${KEY_LOCK_SPACE}, hashtext($${i + 1}))`).join(', ');
    return { query: `SELECT ${shared}, ${each}`, values: keys };
  }
  return { query: `SELECT pg_advisory_xact_lock(${WRITE_LOCK_KEY})`, values: [] };
}

/** A review's id as the int4 second half of its lock key (ids beyond 2^31 wrap; a shared key only makes two reviews wait). */
function reviewLockKey(reviewId: number): number {
  if (!Number.isSafeInteger(reviewId)) throw new Error(`Not a review id: ${reviewId}`);
  return reviewId | 0;
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

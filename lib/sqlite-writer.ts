import { QueryTypes, Transaction, type Sequelize } from 'sequelize';
import { WriteQueue } from '@/lib/write-queue';

/**
 * SQLite has one writer at a time (https://www.sqlite.org/lockingv3.html). Sequelize opens a
 * connection per transaction, so concurrent requests used to race for the file's write lock: the
 * losers slept in SQLite's busy handler on libuv's four pool threads (stalling every other query
 * of the process, reads included) and then failed with SQLITE_BUSY. Here the process keeps its
 * writers in one in-process queue instead: a transaction (BEGIN IMMEDIATE) or a write outside a
 * transaction starts only when the previous one has finished, so the file lock is never contested
 * inside the process, the pool threads never sleep, and readers (WAL) go on beside the writer.
 * A write that waits longer than `waitMs` gets 503 with Retry-After instead of a timeout.
 *
 * Only for SQLite: lib/db.ts applies it to the SQLite connection alone.
 */

const READ_TYPES = new Set<string>([
  QueryTypes.SELECT,
  QueryTypes.SHOWTABLES,
  QueryTypes.SHOWINDEXES,
  QueryTypes.DESCRIBE,
  QueryTypes.FOREIGNKEYS,
]);

/** Whether a statement run outside a transaction may write (and so takes the writer's turn). */
export function isWriteStatement(sql: unknown, type: string | undefined): boolean {
  if (type && READ_TYPES.has(type)) return false;
  const text = typeof sql === 'string' ? sql : ((sql as { query?: string } | null)?.query ?? '');
  return !/^\s*(select|pragma\s+\w+\s*;?\s*$|explain)\b/i.test(text);
}

type TransactionFn = (options?: object, autoCallback?: (t: Transaction) => Promise<unknown>) => Promise<unknown>;
type QueryFn = (sql: unknown, options?: { transaction?: unknown; type?: string }) => Promise<unknown>;

/**
 * Routes every transaction and every write outside one through a single WriteQueue. Transactions
 * begin IMMEDIATE: the write lock is taken at BEGIN, so a writer from another process (a script)
 * waits in SQLite's busy handler instead of failing halfway through.
 */
export function serialiseWrites(sequelize: Sequelize, queue = new WriteQueue()): Sequelize {
  const target = sequelize as unknown as { transaction: TransactionFn; query: QueryFn };
  const transaction = target.transaction.bind(sequelize) as TransactionFn;
  const query = target.query.bind(sequelize) as QueryFn;

  target.query = (sql, options) => {
    if (options?.transaction || queue.heldHere() || !isWriteStatement(sql, options?.type)) return query(sql, options);
    return queue.run(() => query(sql, options));
  };

  type Callback = (t: Transaction) => Promise<unknown>;
  target.transaction = async (optionsOrFn?: object | Callback, maybeFn?: Callback) => {
    const autoCallback = typeof optionsOrFn === 'function' ? (optionsOrFn as Callback) : maybeFn;
    const options = { type: Transaction.TYPES.IMMEDIATE, ...(typeof optionsOrFn === 'object' ? optionsOrFn : {}) };
    // A transaction opened by the holder itself cannot wait for its own turn.
    if (queue.heldHere()) return transaction(options, autoCallback);
    if (autoCallback) return queue.run(() => transaction(options, autoCallback));
    // Unmanaged: the turn ends with commit or rollback.
    const release = await queue.acquire();
    try {
      const t = (await transaction(options)) as Transaction;
      const commit = t.commit.bind(t);
      const rollback = t.rollback.bind(t);
      t.commit = () => commit().finally(release);
      t.rollback = () => rollback().finally(release);
      return t;
    } catch (error) {
      release();
      throw error;
    }
  };
  return sequelize;
}

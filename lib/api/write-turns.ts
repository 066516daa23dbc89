import { WriteQueue, WRITE_WAIT_MS } from '@/lib/write-queue';

/**
 * How many write requests one process works on at once; the rest wait their turn, in arrival
 * order, before their session is read. Writes are CPU-bound in one Node process (and SQLite has
 * one writer anyway), so a burst worked on all at once only interleaves: every request of the
 * process — a reader's GET too — waits for a share of the whole burst's work. Taken a few at a
 * time, the burst finishes no later, and a read waits for those few alone (bench/concurrency.ts
 * measures the unrelated GET during a burst of saves; figures in bench/results/README.md).
 * A request that cannot get its turn within WRITE_WAIT_MS answers 503 with Retry-After.
 */
export const WRITES_AT_ONCE = 4;

const globalForTurns = globalThis as unknown as { loadbearingWriteTurns?: WriteQueue };

/**
 * The process's one queue of write requests (on globalThis: the route bundles of a production
 * build share it, as they share the database connection in lib/db.ts).
 */
function turns(): WriteQueue {
  return (globalForTurns.loadbearingWriteTurns ??= new WriteQueue(WRITE_WAIT_MS, WRITES_AT_ONCE));
}

/** Runs one write request's work in its turn. */
export function inWriteTurn<T>(work: () => Promise<T>): Promise<T> {
  const queue = turns();
  // A server action that calls another wrapped write runs in the turn it has.
  return queue.heldHere() ? work() : queue.run(work);
}

import { AsyncLocalStorage } from 'node:async_hooks';
import { WriteQueue, WRITE_WAIT_MS } from '@/lib/write-queue';
import { isSafeMethod } from '@/lib/auth/same-origin';

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

/**
 * How many writes `npm start`'s server lets into Next at once (scripts/app-server.ts); the rest
 * wait at its door, before Next has parsed them. Next spends several milliseconds of CPU on each
 * request before the route wrapper can make it wait for a turn (bench/request-cost.ts: a
 * signed-out save answered 401 costs the server 7 ms), so a hundred saves let in together cost the
 * process most of a second before the first of them could wait, and a reader's GET waited behind
 * that. At the door a waiting write costs only its socket. Two, measured (bench/concurrency.ts,
 * bench/results/README.md): the p99 of a GET during bursts of 20 and 100 saves was 86 and 108 ms
 * with two, 143–175 ms with four, 175 and 231 ms with six, and the bursts ended about as soon.
 * Behind the door the route wrapper's turns still bound what skips it.
 */
export const WRITES_ADMITTED_AT_ONCE = 2;

/**
 * Which requests wait at the door: everything but reads and multipart bodies. Uploads stream
 * their file as it comes, and form posts of server actions (multipart too) take their turn in
 * formAction (lib/auth/action.ts); held at the door, a slow upload would hold a place for as long
 * as the person's connection takes to send it.
 */
export function waitsAtTheDoor(method: string | undefined, contentType: string | undefined): boolean {
  if (isSafeMethod(method ?? 'GET')) return false;
  return !/^multipart\//i.test(contentType ?? '');
}

const globalForDoor = globalThis as unknown as {
  loadbearingWriteDoor?: WriteQueue;
  loadbearingDoorPlace?: AsyncLocalStorage<() => void>;
};

/** The server's one queue at the door (on globalThis: the server and the route bundles share it). */
export function writeDoor(): WriteQueue {
  return (globalForDoor.loadbearingWriteDoor ??= new WriteQueue(WRITE_WAIT_MS, WRITES_ADMITTED_AT_ONCE));
}

function doorPlace(): AsyncLocalStorage<() => void> {
  return (globalForDoor.loadbearingDoorPlace ??= new AsyncLocalStorage());
}

/** Runs an admitted request's handling with its place at the door, which `leaveTheDoor` gives up. */
export function withDoorPlace<T>(release: () => void, handle: () => T): T {
  return doorPlace().run(release, handle);
}

/**
 * A write that works for seconds (the evidence watch waited for) gives up its place at the door,
 * so it never keeps the short saves out. Nothing happens outside `npm start`'s server.
 */
export function leaveTheDoor(): void {
  doorPlace().getStore()?.();
}

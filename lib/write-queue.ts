import { AsyncLocalStorage } from 'node:async_hooks';
import { busy } from '@/lib/api/errors';

/** How long a write waits for its turn before the request answers 503. */
export const WRITE_WAIT_MS = 10_000;

/**
 * A FIFO of turns with a time limit on waiting: at most `slots` holders at once, the rest wait in
 * arrival order and get 503 with Retry-After after `waitMs`. With one slot it is the SQLite
 * writer's lock (lib/sqlite-writer.ts); with a few, the write requests a process works on at once
 * (lib/api/write-turns.ts). A holder's async context is marked so it never waits on itself.
 */
export class WriteQueue {
  private active = 0;
  private readonly waiters: Array<() => void> = [];
  private readonly holder = new AsyncLocalStorage<true>();
  private meanHoldMs = 5;

  constructor(
    private readonly waitMs = WRITE_WAIT_MS,
    private readonly slots = 1,
  ) {}

  heldHere(): boolean {
    return this.holder.getStore() === true;
  }

  get waiting(): number {
    return this.waiters.length;
  }

  async run<T>(fn: () => Promise<T>): Promise<T> {
    const release = await this.acquire();
    try {
      return await this.holder.run(true, fn);
    } finally {
      release();
    }
  }

  /**
   * Resolves with the release function once it is this caller's turn; rejects with 503 after
   * waitMs. A caller that stops waiting (`signal` aborted: its client went away) leaves the line
   * and gets nothing.
   */
  acquire(signal?: AbortSignal): Promise<() => void> {
    if (this.active < this.slots) {
      this.active += 1;
      return Promise.resolve(this.releaser());
    }
    return new Promise((resolve, reject) => {
      const leave = () => {
        const at = this.waiters.indexOf(grant);
        if (at >= 0) this.waiters.splice(at, 1);
      };
      const gaveUp = () => {
        clearTimeout(timer);
        leave();
        reject(signal?.reason);
      };
      const grant = () => {
        clearTimeout(timer);
        signal?.removeEventListener('abort', gaveUp);
        resolve(this.releaser());
      };
      const timer = setTimeout(() => {
        signal?.removeEventListener('abort', gaveUp);
        leave();
        const waitMs = (this.waiters.length * this.meanHoldMs) / this.slots;
        reject(busy(Math.max(1, Math.ceil(waitMs / 1000))));
      }, this.waitMs);
      this.waiters.push(grant);
      signal?.addEventListener('abort', gaveUp, { once: true });
    });
  }

  private releaser(): () => void {
    const started = Date.now();
    let released = false;
    return () => {
      if (released) return;
      released = true;
      this.meanHoldMs = this.meanHoldMs * 0.9 + (Date.now() - started) * 0.1;
      // The turn passes straight to the next waiter; the count of holders stays the same.
      const next = this.waiters.shift();
      if (next) next();
      else this.active -= 1;
    };
  }
}

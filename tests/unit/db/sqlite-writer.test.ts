import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/api/errors';
import { isWriteStatement } from '@/lib/sqlite-writer';
import { WriteQueue } from '@/lib/write-queue';

describe('the write queue', () => {
  it('runs writers one at a time, in arrival order', async () => {
    const queue = new WriteQueue(1000);
    const log: string[] = [];
    const job = (name: string) =>
      queue.run(async () => {
        log.push(`${name} start`);
        await new Promise((r) => setTimeout(r, 5));
        log.push(`${name} end`);
      });
    await Promise.all([job('a'), job('b'), job('c')]);
    expect(log).toEqual(['a start', 'a end', 'b start', 'b end', 'c start', 'c end']);
  });

  it('answers 503 with Retry-After to a writer that cannot get its turn in time, and moves on', async () => {
    const queue = new WriteQueue(20);
    let release!: () => void;
    const holder = queue.run(() => new Promise<void>((r) => (release = r)));
    const late = queue.run(async () => 'never');
    await expect(late).rejects.toSatisfy(
      (e: unknown) => e instanceof AppError && e.status === 503 && (e.extra.retryAfterSeconds ?? 0) >= 1,
    );
    release();
    await holder;
    await expect(queue.run(async () => 'next')).resolves.toBe('next');
  });

  it('lets the holder write again without waiting for itself', async () => {
    const queue = new WriteQueue(20);
    const nested = queue.run(async () => (queue.heldHere() ? 'inside' : 'outside'));
    await expect(nested).resolves.toBe('inside');
    expect(queue.heldHere()).toBe(false);
  });

  it('with several slots, lets that many in at once and starts the rest in arrival order', async () => {
    const queue = new WriteQueue(1000, 3);
    let inside = 0;
    let most = 0;
    const started: number[] = [];
    await Promise.all(
      Array.from({ length: 7 }, (_, i) =>
        queue.run(async () => {
          started.push(i);
          inside += 1;
          most = Math.max(most, inside);
          await new Promise((r) => setTimeout(r, 5));
          inside -= 1;
        }),
      ),
    );
    expect(most).toBe(3);
    expect(started).toEqual([0, 1, 2, 3, 4, 5, 6]);
    // Every slot was given back: three more get in at once again.
    const again = await Promise.all([1, 2, 3].map(() => queue.acquire()));
    expect(queue.waiting).toBe(0);
    again.forEach((release) => release());
  });

  it('tells reads from writes', () => {
    expect(isWriteStatement('SELECT 1', 'RAW')).toBe(false);
    expect(isWriteStatement('UPDATE reviews SET title = 1', 'RAW')).toBe(true);
    expect(isWriteStatement('INSERT INTO x VALUES (1)', 'INSERT')).toBe(true);
    expect(isWriteStatement('anything', 'SELECT')).toBe(false);
    expect(isWriteStatement('PRAGMA journal_mode=WAL', 'RAW')).toBe(true);
  });
});

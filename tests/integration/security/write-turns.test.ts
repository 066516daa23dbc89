import { describe, expect, it, vi } from 'vitest';
import { WRITES_AT_ONCE, withDoorPlace } from '@/lib/api/write-turns';
import { route } from '@/lib/auth/handler';
import { useTestApp, Client } from '../../helpers/app';

useTestApp();

// The wrapper works on a few write requests at a time (lib/api/write-turns.ts): the rest wait
// before any of their work, and reads never wait for a turn. Shown without a clock: writes that
// hold their turns until released, and a read that answers while they hold them.
describe('write turns', () => {
  it('holds the writes past WRITES_AT_ONCE before their handler runs, and lets a read through meanwhile', async () => {
    let running = 0;
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    const write = route({ auth: 'optional' }, async () => {
      running += 1;
      await held;
      return { ok: true };
    });
    const read = route({ auth: 'optional' }, async () => ({ running }));
    const client = new Client();
    const writes = Array.from({ length: WRITES_AT_ONCE + 3 }, () => client.call(write, { json: {} }));
    // The first ones reach their handler (however busy the machine), then every request gets
    // many more turns of the event loop to go as far as it can: the rest must still be waiting.
    await vi.waitFor(() => expect(running).toBe(WRITES_AT_ONCE), { timeout: 10_000 });
    for (let i = 0; i < 50; i++) await new Promise((r) => setImmediate(r));
    expect(running).toBe(WRITES_AT_ONCE);

    const answer = await client.call(read);
    expect(answer).toMatchObject({ status: 200, body: { running: WRITES_AT_ONCE } });

    release();
    const statuses = (await Promise.all(writes)).map((w) => w.status);
    expect(statuses).toEqual(Array(WRITES_AT_ONCE + 3).fill(200));
    expect(running).toBe(WRITES_AT_ONCE + 3);
  });

  it("gives up a slow write's place at npm start's door, and only a slow one's", async () => {
    const client = new Client();
    const slow = route({ auth: 'optional', slow: true }, async () => ({ ok: true }));
    const quick = route({ auth: 'optional' }, async () => ({ ok: true }));
    const slowPlace = vi.fn();
    const quickPlace = vi.fn();
    await withDoorPlace(slowPlace, () => client.call(slow, { json: {} }));
    await withDoorPlace(quickPlace, () => client.call(quick, { json: {} }));
    expect(slowPlace).toHaveBeenCalledOnce();
    expect(quickPlace).not.toHaveBeenCalled();
  });
});

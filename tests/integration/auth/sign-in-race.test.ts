import { describe, expect, it } from 'vitest';
import { takeTry } from '@/lib/auth/rate-limit';
import { SignInThrottle } from '@/models';
import { useTestApp } from '../../helpers/app';

useTestApp();

// The throttle reads a count, checks it and writes it back. Tries that arrive together — on
// several processes sharing PostgreSQL, or on one — must each be counted, or a guesser who sends
// them in bursts gets more than the stated number of tries.
describe('sign-in tries at the same moment', () => {
  it('are each counted: 4 tries at once from one address for one account leave 4 failures on each', async () => {
    await Promise.all(Array.from({ length: 4 }, () => takeTry('burst@example.test', '10.9.9.9')));
    const rows = await SignInThrottle.findAll({ order: [['key', 'ASC']] });
    expect(rows.map((r) => [r.key, r.failures])).toEqual([
      ['addr:10.9.9.9', 4],
      ['email:burst@example.test', 4],
    ]);
  });

  // A try's clock is read before it waits for its turn; the try that read its clock first may
  // write second. Seen on PostgreSQL under load: the later writer's own try was refused with
  // "try again in 1 seconds" after only 3 failures.
  it('count a try whose clock was read before an earlier-written one', async () => {
    const t0 = Date.parse('2026-12-03T08:00:00Z');
    await takeTry('order@example.test', '10.9.9.8', t0 + 500);
    const counts = await takeTry('order@example.test', '10.9.9.8', t0);
    expect(counts).toMatchObject({ email: 2, address: 2 });
  });
});

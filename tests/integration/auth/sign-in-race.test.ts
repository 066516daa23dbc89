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
});

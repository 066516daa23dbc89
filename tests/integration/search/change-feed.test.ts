import { describe, expect, it } from 'vitest';
import * as search from '@/app/api/search/route';
import { db, isPostgres } from '@/lib/db';
import { CHANNEL } from '@/lib/search/change-feed';
import { useTestApp } from '../../helpers/app';
import { makeTeam } from '../reviews/helpers';
import { readyReview } from '../publishing/helpers';
import { Review } from '@/models';

useTestApp();

/** Polls until `check` holds, up to the documented bound (docs/deployment.md: 2 s). */
async function within2s(check: () => Promise<boolean>): Promise<boolean> {
  const until = Date.now() + 2000;
  while (Date.now() < until) {
    if (await check()) return true;
    await new Promise((r) => setTimeout(r, 50));
  }
  return check();
}

// Several processes share search only on PostgreSQL (LISTEN/NOTIFY); SQLite is one process.
describe.skipIf(!isPostgres())('search across processes (PostgreSQL)', () => {
  it("applies another process's announced change to this process's kept index", async () => {
    const t = await makeTeam('feed');
    const find = async (q: string) =>
      (await t.owner.call(search.GET, { path: `/api/search?q=${q}&teamId=${t.teamId}` })).body.results as {
        id: number;
      }[];
    await find('anything'); // builds this process's index (and starts listening)

    const { id } = await readyReview(t.coach, t.teamId, { claim: 'Pinch block lifting stiffens thumb tendons fast.' });
    // What another process does: changes the row (here around this process's hooks), then announces it.
    await Review.update({ claim: 'Isometric neck holds prevent concussions in rugby.' }, { where: { id } });
    const row = { id };
    expect((await find('isometrik')).map((r) => r.id)).not.toContain(row.id);
    await db().query('SELECT pg_notify(?, ?)', {
      replacements: [CHANNEL, JSON.stringify({ kind: 'review', id: row.id, origin: 'another-process' })],
    });
    expect(await within2s(async () => (await find('isometrik')).some((r) => r.id === row.id))).toBe(true);
  });
});

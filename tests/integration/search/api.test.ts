import { beforeAll, describe, expect, it } from 'vitest';
import * as publish from '@/app/api/reviews/[id]/publish/route';
import * as search from '@/app/api/search/route';
import * as verdicts from '@/app/api/verdicts/route';
import { isIndexBuilt, onReviewChanged } from '@/lib/search/index-store';
import { Review } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, type TeamFixture } from '../reviews/helpers';
import { readyReview } from '../publishing/helpers';

useTestApp();
let t: TeamFixture;

beforeAll(async () => {
  t = await makeTeam('srch');
});

const find = (client: TeamFixture['owner'], q: string, extra = '') =>
  client.call(search.GET, { path: `/api/search?q=${encodeURIComponent(q)}&teamId=${t.teamId}${extra}` });

describe('GET /api/search', () => {
  it('is for staff: athletes 403, outsiders 404, signed out 401; an empty or over-long q is 400 in the error shape of docs/api/README.md', async () => {
    expect((await find(t.athlete, 'x')).status).toBe(403);
    expect((await find(t.outsider, 'x')).status).toBe(404);
    expect((await find(t.anonymous, 'x')).status).toBe(401);
    const empty = await t.owner.call(search.GET, { path: '/api/search?q=' });
    expect(empty.status).toBe(400);
    expect(empty.body.issues[0]).toEqual({ path: 'q', message: expect.any(String) });
    expect((await t.owner.call(search.GET, { path: `/api/search?q=${'a'.repeat(201)}` })).status).toBe(400);
    expect((await find(t.owner, 'x', '&kind=everything')).status).toBe(400);
  });

  it('finds reviews, mechanisms and studies by misspelled words, with highlighted ranges', async () => {
    const { id } = await readyReview(t.coach, t.teamId, { claim: 'Pinch block lifting stiffens thumb tendons fast.' });
    const res = await find(t.reviewer, 'thum tendns');
    expect(res.status).toBe(200);
    expect(res.body.results[0]).toMatchObject({ kind: 'review', id, href: `/reviews/${id}` });
    expect(res.body.results[0].matches.length).toBeGreaterThan(0);
    const mech = await find(t.coach, 'tendn stifness', '&kind=mechanism');
    expect(mech.body.results[0]).toMatchObject({ kind: 'mechanism', title: 'Tendon stiffness' });
  });

  it('builds the team index once and keeps it current through the change hook, not by rebuilding per request', async () => {
    expect(isIndexBuilt(t.teamId)).toBe(true);
    const { id } = await readyReview(t.coach, t.teamId, {
      claim: 'Barefoot running strengthens arches quickly.',
      tags: ['feet'],
    });
    // The create route announces the new review to the kept index, so a typo finds it at once.
    expect((await find(t.owner, 'barefot')).body.results[0]).toMatchObject({ kind: 'review', id });
    // A change that bypasses the routes is not seen: a per-request rebuild would drop the row, the kept index does not.
    await Review.destroy({ where: { id } });
    expect((await find(t.owner, 'barefoot')).body.results.map((r: { id: number }) => r.id)).toContain(id);
    await onReviewChanged(id);
    expect((await find(t.owner, 'barefoot')).body.results.map((r: { id: number }) => r.id)).not.toContain(id);
  });
});

describe('GET /api/verdicts?q=', () => {
  it('finds a published verdict by a misspelled word: the athlete sees team and public ones, the public only public ones', async () => {
    const a = await readyReview(t.coach, t.teamId, { claim: 'Kettlebell swings cure lower back pain in climbers.' });
    const b = await readyReview(t.coach, t.teamId, {
      claim: 'Kettlebell carries build crimp strength for boulderers.',
    });
    const pa = await t.owner.call(publish.POST, { params: { id: String(a.id) }, json: { visibility: 'team' } });
    const pb = await t.owner.call(publish.POST, { params: { id: String(b.id) }, json: { visibility: 'public' } });
    const q = (client: TeamFixture['owner']) =>
      client
        .call(verdicts.GET, { path: '/api/verdicts?q=kettlebel' })
        .then((r) => r.body.verdicts.map((v: { slug: string }) => v.slug));
    expect(await q(t.athlete)).toEqual(expect.arrayContaining([pa.body.slug, pb.body.slug]));
    expect(await q(t.anonymous)).toEqual([pb.body.slug]);
    expect(await q(t.outsider)).toEqual([pb.body.slug]);
    const crimp = await t.athlete.call(verdicts.GET, { path: '/api/verdicts?q=crimpp%20strenght' });
    expect(crimp.body.verdicts[0]).toMatchObject({ slug: pb.body.slug, verdictLabel: expect.any(String) });
    expect(crimp.body.verdicts[0].matches.length).toBeGreaterThan(0);
    expect((await t.anonymous.call(verdicts.GET, { path: '/api/verdicts?limit=0' })).status).toBe(400);
  });
});

import { beforeAll, describe, expect, it } from 'vitest';
import * as appraisalsRoute from '@/app/api/reviews/[id]/appraisals/route';
import * as metaRoute from '@/app/api/reviews/[id]/meta-analysis/route';
import * as mechanismRoute from '@/app/api/reviews/[id]/mechanisms/[mechanismId]/route';
import * as mechanismsRoute from '@/app/api/reviews/[id]/mechanisms/route';
import * as reviewRoute from '@/app/api/reviews/[id]/route';
import * as verdictRoute from '@/app/api/reviews/[id]/verdict/route';
import * as reviewsRoute from '@/app/api/reviews/route';
import * as roundsRoute from '@/app/api/reviews/[id]/rounds/route';
import * as scorecardRoute from '@/app/api/reviews/[id]/rounds/[roundId]/scorecard/route';
import { useTestApp } from '../../helpers/app';
import { makeTeam, type TeamFixture } from '../reviews/helpers';
import { inDays, reviewWithMechanisms, roundSnapshot } from './helpers';

useTestApp();
let t: TeamFixture;
let reviewId: number;
let mechanismIds: number[];
let roundId: number;
const id = () => ({ id: String(reviewId) });

beforeAll(async () => {
  t = await makeTeam('freeze');
  ({ reviewId, mechanismIds } = await reviewWithMechanisms(t, 'Frozen during its round'));
  const opened = await t.coach.call(roundsRoute.POST, { params: id(), json: { reviewerIds: [t.userIds.reviewer], dueAt: inDays(3) } });
  expect(opened.status).toBe(201);
  roundId = opened.body.round.id;
});

describe('the workbench routes while a round is open', () => {
  it('refuse every write to the review, its mechanisms and appraisals with 409, and change nothing', async () => {
    const before = await roundSnapshot();
    const current = await t.coach.call(reviewRoute.GET, { params: id() });
    const writes = [
      () => t.coach.call(reviewRoute.PATCH, { method: 'PATCH', params: id(), json: { version: current.body.review.version, title: 'Edited' } }),
      () => t.coach.call(mechanismsRoute.POST, { params: id(), json: { name: 'Late idea', prior: 0.5 } }),
      () => t.coach.call(mechanismRoute.PATCH, { method: 'PATCH', params: { ...id(), mechanismId: String(mechanismIds[0]) }, json: { prior: 0.9 } }),
      () => t.coach.call(mechanismRoute.DELETE, { method: 'DELETE', params: { ...id(), mechanismId: String(mechanismIds[1]) } }),
      () => t.coach.call(appraisalsRoute.POST, { params: id(), json: { studyId: 1, mechanismId: mechanismIds[0], direction: 'supports' } }),
    ];
    for (const write of writes) {
      const res = await write();
      expect(res.status).toBe(409);
      expect(res.body.error).toMatch(/peer-review round/);
    }
    expect(await roundSnapshot()).toEqual(before);
    const after = await t.coach.call(reviewRoute.GET, { params: id() });
    expect(after.body.mechanisms).toHaveLength(3);
    expect(after.body.review.title).toBe(current.body.review.title);
  });

  it('hide the engine from the invited reviewer until they submit (raw JSON), but not from the author', async () => {
    for (const handler of [reviewRoute.GET, verdictRoute.GET]) {
      const blind = await t.reviewer.call(handler, { params: id() });
      expect(blind.status).toBe(403);
      expect(JSON.stringify(blind.body)).not.toMatch(/probability|evidenceWeight|certainty/);
      expect((await t.coach.call(handler, { params: id() })).status).toBe(200);
    }
    const meta = await t.reviewer.call(metaRoute.GET, { path: `/api/reviews/${reviewId}/meta-analysis?mechanism=outcome`, params: id() });
    expect(meta.status).toBe(403);
    const list = await t.reviewer.call(reviewsRoute.GET, { path: `/api/reviews?teamId=${t.teamId}` });
    const row = list.body.reviews.find((r: { id: number }) => r.id === reviewId);
    expect(row.verdict).toBeNull();
    expect(row.verdictLabel).toBeNull();
  });

  it('show the engine to the reviewer once their scorecard is in', async () => {
    const ratings = mechanismIds.map((mechanismId) => ({ mechanismId, band: 3, contribution: 'small', comment: '' }));
    const draft = await t.reviewer.call(scorecardRoute.PUT, {
      method: 'PUT',
      params: { ...id(), roundId: String(roundId) },
      json: { ratings, overallComment: 'Fine.', signOff: 'approve', submit: true },
    });
    expect(draft.status, JSON.stringify(draft.body)).toBe(200);
    expect((await t.reviewer.call(verdictRoute.GET, { params: id() })).status).toBe(200);
  });
});

import { beforeAll, describe, expect, it } from 'vitest';
import * as appraisalsRoute from '@/app/api/reviews/[id]/appraisals/route';
import * as commentsRoute from '@/app/api/reviews/[id]/comments/route';
import * as agreementRoute from '@/app/api/reviews/[id]/rounds/[roundId]/agreement/route';
import * as roundRoute from '@/app/api/reviews/[id]/rounds/[roundId]/route';
import * as roundsRoute from '@/app/api/reviews/[id]/rounds/route';
import * as reviewsRoute from '@/app/api/reviews/route';
import * as searchRoute from '@/app/api/search/route';
import * as studyRoute from '@/app/api/studies/[id]/route';
import * as studiesRoute from '@/app/api/studies/route';
import { VERDICT_KEYS } from '@/lib/scoring/constants';
import { Review } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, type TeamFixture } from '../reviews/helpers';
import { inDays, reviewWithMechanisms } from '../rounds/helpers';

// While an invited reviewer has not submitted, no read route tells them the engine's verdict,
// probabilities, certainty or applicability of that review.
useTestApp();
let t: TeamFixture;
let reviewId: number;
let roundId: number;
let studyId: number;
let verdict: string;
const TITLE = 'Blindfolded hangboard claim';

beforeAll(async () => {
  t = await makeTeam('blind');
  ({ reviewId } = await reviewWithMechanisms(t, TITLE));
  const study = await t.coach.call(studiesRoute.POST, {
    json: {
      teamId: t.teamId,
      title: 'A trial of blind hangs',
      year: 2024,
      design: 'randomized',
      population: 'recreational',
      intensity: 0.8,
    },
  });
  studyId = study.body.studies[0].id;
  const appraisal = await t.coach.call(appraisalsRoute.POST, {
    params: { id: String(reviewId) },
    json: { studyId, mechanismId: null, direction: 'supports' },
  });
  expect(appraisal.status).toBe(201);
  verdict = (await Review.findByPk(reviewId))!.verdict as string;
  expect(verdict).toBeTruthy();
  const opened = await t.coach.call(roundsRoute.POST, {
    params: { id: String(reviewId) },
    json: { reviewerIds: [t.userIds.reviewer], dueAt: inDays(3) },
  });
  expect(opened.status).toBe(201);
  roundId = opened.body.round.id;
});

const search = (query: string) => t.reviewer.call(searchRoute.GET, { path: `/api/search?${query}` });

describe('blind scoring on every read route', () => {
  it('search shows the review without its verdict', async () => {
    const res = await search(`q=${encodeURIComponent('Blindfolded')}&teamId=${t.teamId}`);
    expect(res.status).toBe(200);
    const hit = res.body.results.find((r: { kind: string; id: number }) => r.kind === 'review' && r.id === reviewId);
    expect(hit).toBeDefined();
    expect(hit.verdict).toBeNull();
    // The author still sees it.
    const own = await t.coach.call(searchRoute.GET, { path: `/api/search?q=Blindfolded&teamId=${t.teamId}` });
    expect(
      own.body.results.find((r: { id: number; kind: string }) => r.kind === 'review' && r.id === reviewId).verdict,
    ).toBe(verdict);
  });

  it('the verdict filter is no oracle: the review matches no verdict at all', async () => {
    for (const v of VERDICT_KEYS) {
      const res = await search(`q=Blindfolded&verdict=${v}&teamId=${t.teamId}`);
      expect(res.status).toBe(200);
      expect(res.body.results.map((r: { id: number }) => r.id)).not.toContain(reviewId);
    }
  });

  it('the study shows no certainty or applicability derived in that review', async () => {
    const res = await t.reviewer.call(studyRoute.GET, { params: { id: String(studyId) } });
    expect(res.status).toBe(200);
    expect(res.body.appraisals.filter((a: { reviewId: number }) => a.reviewId === reviewId)).toEqual([]);
    const own = await t.coach.call(studyRoute.GET, { params: { id: String(studyId) } });
    expect(own.body.appraisals[0]).toMatchObject({ reviewId, certainty: expect.any(String) });
  });

  it('the other read routes carry no verdict or engine numbers', async () => {
    const p = { id: String(reviewId) };
    const reads = [
      await t.reviewer.call(reviewsRoute.GET, { path: `/api/reviews?teamId=${t.teamId}` }),
      await t.reviewer.call(roundsRoute.GET, { params: p }),
      await t.reviewer.call(roundRoute.GET, { params: { ...p, roundId: String(roundId) } }),
      await t.reviewer.call(agreementRoute.GET, { params: { ...p, roundId: String(roundId) } }),
      await t.reviewer.call(commentsRoute.GET, { params: p, path: `/api/reviews/${reviewId}/comments` }),
    ];
    for (const res of reads) {
      const text = JSON.stringify(res.body);
      expect(text).not.toMatch(/"probability"|"evidenceWeight"|"certainty"|"applicability"/);
      expect(text).not.toContain(`"verdict":"${verdict}"`);
    }
  });
});

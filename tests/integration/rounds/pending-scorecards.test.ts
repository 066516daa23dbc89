import { beforeAll, describe, expect, it } from 'vitest';
import * as closeRoute from '@/app/api/reviews/[id]/rounds/[roundId]/close/route';
import * as roundsRoute from '@/app/api/reviews/[id]/rounds/route';
import * as scorecardRoute from '@/app/api/reviews/[id]/rounds/[roundId]/scorecard/route';
import { pendingScorecards } from '@/lib/rounds/queries';
import { useTestApp } from '../../helpers/app';
import { makeTeam, type TeamFixture } from '../reviews/helpers';
import { inDays, reviewWithMechanisms } from './helpers';

useTestApp();
let t: TeamFixture;

beforeAll(async () => {
  t = await makeTeam('pending');
});

describe("the dashboard's scorecards waiting for a reviewer", () => {
  it('lists open rounds the reviewer owes, soonest due first, until they submit or the round closes', async () => {
    const later = await reviewWithMechanisms(t, 'Scored later');
    const sooner = await reviewWithMechanisms(t, 'Scored sooner');
    const open = async (reviewId: number, days: number) => {
      const res = await t.coach.call(roundsRoute.POST, {
        params: { id: String(reviewId) },
        json: { reviewerIds: [t.userIds.reviewer], dueAt: inDays(days) },
      });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      return res.body.round.id as number;
    };
    const laterRound = await open(later.reviewId, 6);
    const soonerRound = await open(sooner.reviewId, 2);

    const owed = await pendingScorecards(t.userIds.reviewer);
    expect(owed.map((p) => p.title)).toEqual(['Scored sooner', 'Scored later']);
    expect(owed[0]).toMatchObject({
      reviewId: sooner.reviewId,
      roundId: soonerRound,
      overdue: false,
      draftSaved: false,
    });
    expect(await pendingScorecards(t.userIds.coach)).toEqual([]);
    // A week on, both are overdue.
    expect(
      (await pendingScorecards(t.userIds.reviewer, new Date(Date.now() + 7 * 86_400_000))).every((p) => p.overdue),
    ).toBe(true);

    const ratings = sooner.mechanismIds.map((mechanismId) => ({
      mechanismId,
      band: 3,
      contribution: 'small',
      comment: '',
    }));
    const card = (submit: boolean) =>
      t.reviewer.call(scorecardRoute.PUT, {
        method: 'PUT',
        params: { id: String(sooner.reviewId), roundId: String(soonerRound) },
        json: { ratings, overallComment: 'Fine.', signOff: 'approve', submit },
      });
    expect((await card(false)).status).toBe(200);
    expect((await pendingScorecards(t.userIds.reviewer))[0].draftSaved).toBe(true);
    expect((await card(true)).status).toBe(200);
    expect((await pendingScorecards(t.userIds.reviewer)).map((p) => p.roundId)).toEqual([laterRound]);

    const closed = await t.coach.call(closeRoute.POST, {
      params: { id: String(later.reviewId), roundId: String(laterRound) },
      json: { closedWithout: [{ reviewerId: t.userIds.reviewer, reason: 'Closed early: the claim changed.' }] },
    });
    expect(closed.status, JSON.stringify(closed.body)).toBe(200);
    expect(await pendingScorecards(t.userIds.reviewer)).toEqual([]);
  });
});

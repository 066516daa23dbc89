import { beforeAll, describe, expect, it } from 'vitest';
import * as one from '@/app/api/reviews/[id]/route';
import * as reviews from '@/app/api/reviews/route';
import * as member from '@/app/api/teams/[teamId]/members/route';
import { useTestApp } from '../../helpers/app';
import { makeTeam, newReview, type TeamFixture } from '../reviews/helpers';

// Ids are positive integers written as such; nothing else may open a row.
useTestApp();
let t: TeamFixture;
let reviewId: number;

beforeAll(async () => {
  t = await makeTeam('ids');
  reviewId = (await t.coach.call(reviews.POST, { json: newReview(t.teamId) })).body.review.id;
});

const spelledOtherwise = (id: number) => [
  `0x${id.toString(16)}`,
  `${id}e0`,
  `+${id}`,
  ` ${id}`,
  `${id} `,
  `0${id}`,
  `${id}.0`,
  'true',
  '-1',
  '0',
];

describe('strict ids', () => {
  it('in paths: only the plain digits open the row', async () => {
    expect((await t.coach.call(one.GET, { params: { id: String(reviewId) } })).status).toBe(200);
    for (const id of spelledOtherwise(reviewId)) {
      expect((await t.coach.call(one.GET, { params: { id } })).status, JSON.stringify(id)).toBe(400);
    }
    for (const teamId of spelledOtherwise(t.teamId)) {
      expect((await t.owner.call(member.GET, { params: { teamId } })).status, JSON.stringify(teamId)).toBe(400);
    }
  });

  it('in JSON bodies: only a number', async () => {
    for (const teamId of [String(t.teamId), true, [t.teamId], `0x${t.teamId}`, t.teamId + 0.5, 0, -t.teamId]) {
      const res = await t.coach.call(reviews.POST, { json: newReview(t.teamId, { teamId }) });
      expect(res.status, JSON.stringify(teamId)).toBe(400);
    }
    expect((await t.coach.call(reviews.POST, { json: newReview(t.teamId) })).status).toBe(201);
  });
});

import { beforeAll, describe, expect, it } from 'vitest';
import * as publish from '@/app/api/reviews/[id]/publish/route';
import * as reviews from '@/app/api/reviews/route';
import { useTestApp } from '../../helpers/app';
import { makeTeam, newReview, type TeamFixture } from '../reviews/helpers';

/** The publish box asks the policy first, so a coach who may not publish gets no button that fails. */

useTestApp();
let t: TeamFixture;
let reviewId: number;

beforeAll(async () => {
  t = await makeTeam('mp');
  reviewId = (await t.coach.call(reviews.POST, { json: newReview(t.teamId) })).body.review.id;
});

describe('GET /api/reviews/:id/publish says whether the reader may publish', () => {
  it('allows the owner and refuses a coach while the team keeps publishing to its owner', async () => {
    const params = { id: String(reviewId) };
    const owner = await t.owner.call(publish.GET, { params });
    expect(owner.status).toBe(200);
    expect(owner.body.mayPublish).toBe(true);
    const coach = await t.coach.call(publish.GET, { params });
    expect(coach.status).toBe(200);
    expect(coach.body.mayPublish).toBe(false);
    expect((await t.reviewer.call(publish.GET, { params })).body.mayPublish).toBe(false);
  });
});

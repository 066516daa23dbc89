import { beforeAll, describe, expect, it } from 'vitest';
import * as roundsRoute from '@/app/api/reviews/[id]/rounds/route';
import { copyMechanism } from '@/lib/reviews/copy-mechanism';
import { Mechanism } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, snapshot, type TeamFixture } from '../reviews/helpers';
import { inDays, reviewWithMechanisms } from '../rounds/helpers';

// The freeze of an open round holds for server actions too: "copy a mechanism from a past
// review" (copyMechanismAction → copyMechanism) writes into the review being written.
useTestApp();
let t: TeamFixture;
let frozenId: number;
let pastMechanismId: number;

beforeAll(async () => {
  t = await makeTeam('frz');
  const past = await reviewWithMechanisms(t, 'A past review');
  pastMechanismId = past.mechanismIds[0];
  ({ reviewId: frozenId } = await reviewWithMechanisms(t, 'Under review now'));
  const opened = await t.coach.call(roundsRoute.POST, {
    params: { id: String(frozenId) },
    json: { reviewerIds: [t.userIds.reviewer], dueAt: inDays(3) },
  });
  expect(opened.status).toBe(201);
});

describe('the freeze on server actions', () => {
  it('copying a mechanism into a review in an open round is refused with 409 and changes nothing', async () => {
    const before = await snapshot();
    const mechanisms = await Mechanism.count({ where: { reviewId: frozenId } });
    await expect(copyMechanism(pastMechanismId, frozenId)).rejects.toMatchObject({ status: 409 });
    expect(await Mechanism.count({ where: { reviewId: frozenId } })).toBe(mechanisms);
    expect(await snapshot()).toEqual(before);
  });
});

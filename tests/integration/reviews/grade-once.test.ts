import { beforeAll, describe, expect, it, vi } from 'vitest';
import * as appraisalOne from '@/app/api/reviews/[id]/appraisals/[appraisalId]/route';
import * as appraisals from '@/app/api/reviews/[id]/appraisals/route';
import * as reviews from '@/app/api/reviews/route';
import * as studies from '@/app/api/studies/route';
import { DOWNGRADE_DOMAINS } from '@/lib/scoring/appraisal-vocabulary';
import { gradeCertainty } from '@/lib/scoring/certainty';
import { Appraisal } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, newReview, type TeamFixture } from './helpers';

// Count the certainty gradings of a write: the real function, watched.
vi.mock('@/lib/scoring/certainty', async (importOriginal) => {
  const original = await importOriginal<typeof import('@/lib/scoring/certainty')>();
  return { ...original, gradeCertainty: vi.fn(original.gradeCertainty) };
});
const graded = vi.mocked(gradeCertainty);

useTestApp();
let t: TeamFixture;
let reviewId: number;
let studyId: number;

beforeAll(async () => {
  t = await makeTeam('once');
  reviewId = (await t.coach.call(reviews.POST, { json: newReview(t.teamId) })).body.review.id;
  const res = await t.coach.call(studies.POST, {
    json: { teamId: t.teamId, title: 'Hangs in recreational climbers: a trial', year: 2024, design: 'randomized' },
  });
  studyId = res.body.studies[0].id;
});

describe('an appraisal write', () => {
  it('grades the appraisal once, and answers with that grading', async () => {
    graded.mockClear();
    const created = await t.coach.call(appraisals.POST, {
      params: { id: String(reviewId) },
      json: { studyId, mechanismId: null, direction: 'supports', riskOfBias: 'serious' },
    });
    expect(created.status).toBe(201);
    expect(created.body.appraisal.certainty).toBe('moderate');
    expect(graded).toHaveBeenCalledTimes(1);

    graded.mockClear();
    const updated = await t.coach.call(appraisalOne.PATCH, {
      params: { id: String(reviewId), appraisalId: String(created.body.appraisal.id) },
      json: { imprecision: 'serious' },
    });
    expect(updated.status).toBe(200);
    expect(updated.body.appraisal.certainty).toBe('low');
    expect(graded).toHaveBeenCalledTimes(1);
  });

  it('stores each domain in its own column, and a re-read grades the same', async () => {
    const other = await t.coach.call(studies.POST, {
      json: { teamId: t.teamId, title: 'A second trial', year: 2023, design: 'randomized' },
    });
    const concerns = { riskOfBias: 'serious', inconsistency: 'none', indirectness: 'very-serious' } as const;
    const created = await t.coach.call(appraisals.POST, {
      params: { id: String(reviewId) },
      json: { studyId: other.body.studies[0].id, mechanismId: null, direction: 'against', ...concerns },
    });
    expect(created.status).toBe(201);
    const row = await Appraisal.findByPk(created.body.appraisal.id, { raw: true });
    const expected: Record<string, string> = concerns;
    for (const domain of DOWNGRADE_DOMAINS)
      expect([domain, row?.[domain]]).toEqual([domain, expected[domain] ?? 'none']);
    // Randomized starts at 4; serious −1, very serious −2 → 1, very low (GRADE Handbook, 2013).
    expect(created.body.appraisal.certainty).toBe('very-low');
  });
});

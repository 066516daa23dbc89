import { beforeAll, describe, expect, it } from 'vitest';
import * as appraisalOne from '@/app/api/reviews/[id]/appraisals/[appraisalId]/route';
import * as appraisals from '@/app/api/reviews/[id]/appraisals/route';
import * as meta from '@/app/api/reviews/[id]/meta-analysis/route';
import * as mechanisms from '@/app/api/reviews/[id]/mechanisms/route';
import * as one from '@/app/api/reviews/[id]/route';
import * as reviews from '@/app/api/reviews/route';
import * as studies from '@/app/api/studies/route';
import { Appraisal } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, newReview, type TeamFixture } from './helpers';

/**
 * What a coach enters through the routes is what the routes give back, field by field, and the
 * direction rules of docs/scoring.md §10 hold at the API: effects are oriented to the target's
 * desirable direction, and a direction the effect does not suggest needs a reason.
 */

useTestApp();
let t: TeamFixture;
let reviewId: number;
const params = (extra: Record<string, string> = {}) => ({ id: String(reviewId), ...extra });

async function study(title: string, effect: Record<string, unknown> | null): Promise<number> {
  const res = await t.coach.call(studies.POST, {
    json: {
      teamId: t.teamId,
      title,
      year: 2024,
      design: 'randomized',
      population: 'recreational',
      intensity: 0.8,
      effect,
    },
  });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  return res.body.studies[0].id;
}

beforeAll(async () => {
  t = await makeTeam('dir');
  // A pain score: lower is the claimed benefit.
  const res = await t.coach.call(reviews.POST, { json: newReview(t.teamId, { outcomeDesirable: 'lower' }) });
  expect(res.status).toBe(201);
  expect(res.body.review.outcomeDesirable).toBe('lower');
  reviewId = res.body.review.id;
});

describe('round trip through the routes', () => {
  it('stores each certainty domain and every other appraisal field as sent', async () => {
    const sid = await study('Five domains, five answers', null);
    const sent = {
      studyId: sid,
      mechanismId: null,
      direction: 'neutral',
      riskOfBias: 'serious',
      inconsistency: 'none',
      indirectness: 'very-serious',
      imprecision: 'serious',
      publicationBias: 'none',
      largeEffect: 1,
      doseResponse: true,
      confoundingWouldReduce: false,
      applicabilityOverride: 0.4,
      overrideReason: 'Older lifters than ours.',
      directionReason: null,
      notes: 'Checked twice.',
    };
    const created = await t.coach.call(appraisals.POST, { params: params(), json: sent });
    expect(created.status).toBe(201);
    expect(created.body.appraisal).toMatchObject(sent);
    const wb = await t.coach.call(one.GET, { params: params() });
    const stored = wb.body.appraisals.find((a: { id: number }) => a.id === created.body.appraisal.id);
    expect(stored).toMatchObject({ ...sent, needsCheck: false });
    // Every domain counted: randomized 4, −1 (serious), −2 (very serious), −1 (serious) → below 1 → very low.
    expect(stored.certainty).toBe('very-low');
  });

  it('stores a mechanism’s fields, its desirable direction among them', async () => {
    const sent = {
      name: 'Less guarding',
      kind: 'perceptual',
      summary: 'Pain falls as fear of movement falls.',
      minIntensity: 0.3,
      minEffort: 'moderate',
      prior: 0.35,
      magnitude: 'small',
      stated: true,
      desirable: 'lower',
    };
    const created = await t.coach.call(mechanisms.POST, { params: params(), json: sent });
    expect(created.status).toBe(201);
    const wb = await t.coach.call(one.GET, { params: params() });
    expect(wb.body.mechanisms.find((m: { id: number }) => m.id === created.body.mechanism.id)).toMatchObject(sent);
  });

  it('clears “needs a check” when a coach saves the appraisal again', async () => {
    const wb = await t.coach.call(one.GET, { params: params() });
    const id = wb.body.appraisals[0].id as number;
    await Appraisal.update({ needsCheck: true }, { where: { id } });
    const flagged = await t.coach.call(one.GET, { params: params() });
    expect(flagged.body.appraisals[0].needsCheck).toBe(true);
    const saved = await t.coach.call(appraisalOne.PATCH, {
      method: 'PATCH',
      params: params({ appraisalId: String(id) }),
      json: { riskOfBias: 'serious' },
    });
    expect(saved.status).toBe(200);
    expect(saved.body.appraisal.needsCheck).toBe(false);
  });
});

describe('direction from effects (docs/scoring.md §10)', () => {
  let painDrop: number;
  let painDrop2: number;

  beforeAll(async () => {
    // Pain fell by 0.5 SD (y −0.5, se 0.1): oriented 0.5 ± 0.196 → suggests "supports".
    painDrop = await study('Pain fell a lot', { kind: 'ready', effectSize: -0.5, variance: 0.01, measure: 'smd' });
    painDrop2 = await study('Pain fell a little', { kind: 'ready', effectSize: -0.3, variance: 0.02, measure: 'smd' });
  });

  it('asks for a reason when the direction differs from the one the effect suggests', async () => {
    const refused = await t.coach.call(appraisals.POST, {
      params: params(),
      json: { studyId: painDrop, mechanismId: null, direction: 'against' },
    });
    expect(refused.status).toBe(400);
    expect(refused.body.issues.map((i: { path: string }) => i.path)).toContain('directionReason');
    expect(await Appraisal.count({ where: { studyId: painDrop } })).toBe(0);

    const withReason = await t.coach.call(appraisals.POST, {
      params: params(),
      json: {
        studyId: painDrop,
        mechanismId: null,
        direction: 'against',
        directionReason: 'The control group got rest.',
      },
    });
    expect(withReason.status).toBe(201);
    expect(withReason.body.appraisal.directionReason).toBe('The control group got rest.');

    const agreeing = await t.coach.call(appraisals.POST, {
      params: params(),
      json: { studyId: painDrop2, mechanismId: null, direction: 'supports' },
    });
    expect(agreeing.status).toBe(201);
  });

  it('orients the forest plot and the pooled estimate so that right is the claimed benefit', async () => {
    const res = await t.coach.call(meta.GET, {
      params: params(),
      path: '/api/reviews/x/meta-analysis?mechanism=outcome',
    });
    expect(res.status).toBe(200);
    expect(res.body.desirable).toBe('lower');
    const bySize = res.body.studies.map((s: { effectSize: number }) => s.effectSize).sort();
    expect(bySize).toEqual([0.3, 0.5]);
    expect(res.body.random.estimate).toBeGreaterThan(0);
  });
});

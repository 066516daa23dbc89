import { beforeAll, describe, expect, it } from 'vitest';
import * as appraisalOne from '@/app/api/reviews/[id]/appraisals/[appraisalId]/route';
import * as appraisals from '@/app/api/reviews/[id]/appraisals/route';
import * as mechanismOne from '@/app/api/reviews/[id]/mechanisms/[mechanismId]/route';
import * as mechanisms from '@/app/api/reviews/[id]/mechanisms/route';
import * as one from '@/app/api/reviews/[id]/route';
import * as reviews from '@/app/api/reviews/route';
import * as studies from '@/app/api/studies/route';
import { Appraisal } from '@/models';
import { Client, useTestApp } from '../../helpers/app';
import { makeTeam, newReview, snapshot, type TeamFixture } from './helpers';

useTestApp();
let t: TeamFixture;
let reviewId: number;
let otherReviewId: number;
/** Studies by role in the tests. */
const s: Record<string, number> = {};

async function study(client: Client, teamId: number, fields: Record<string, unknown>): Promise<number> {
  const res = await client.call(studies.POST, { json: { teamId, ...fields } });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  return res.body.studies[0].id;
}

beforeAll(async () => {
  t = await makeTeam('ma');
  reviewId = (await t.coach.call(reviews.POST, { json: newReview(t.teamId) })).body.review.id;
  otherReviewId = (await t.coach.call(reviews.POST, { json: newReview(t.teamId, { title: 'Another review' }) })).body
    .review.id;
  // The review's target: recreational, healthy, intensity 0.8 (see helpers.protocol).
  s.sameRct = await study(t.coach, t.teamId, {
    title: 'Hangs in recreational climbers: a trial',
    year: 2024,
    design: 'randomized',
    population: 'recreational',
    intensity: 0.8,
  });
  s.trainedHalfDose = await study(t.coach, t.teamId, {
    title: 'Hangs at 40 percent in trained climbers',
    year: 2023,
    design: 'randomized',
    population: 'trained',
    intensity: 0.4,
  });
  s.cohort = await study(t.coach, t.teamId, {
    title: 'A cohort of hangboard users',
    year: 2022,
    design: 'cohort',
    population: 'elite',
    injured: true,
  });
  s.noDesign = await study(t.coach, t.teamId, { title: 'A study whose design is not recorded', year: 2021 });
  s.otherTeam = await study(t.outsider, t.otherTeamId, {
    title: 'Another team’s study',
    year: 2020,
    design: 'randomized',
  });
});

const params = (extra: Record<string, string> = {}) => ({ id: String(reviewId), ...extra });

describe('mechanisms', () => {
  let first: number;

  it('adds mechanisms with defaults, in order, and inserts at a position', async () => {
    const a = await t.coach.call(mechanisms.POST, {
      params: params(),
      json: { name: 'Neural drive', kind: 'physiological', stated: true },
    });
    expect(a.status).toBe(201);
    expect(a.body.mechanism).toEqual({
      id: expect.any(Number),
      reviewId,
      name: 'Neural drive',
      kind: 'physiological',
      summary: '',
      minIntensity: null,
      minEffort: null,
      prior: 0.5,
      magnitude: 'moderate',
      stated: true,
      desirable: 'higher',
      position: 0,
    });
    first = a.body.mechanism.id;
    const b = await t.owner.call(mechanisms.POST, {
      params: params(),
      json: { name: 'Tendon stiffness', minIntensity: 0.9, minEffort: 'to-failure', prior: 0.3, magnitude: 'large' },
    });
    expect(b.body.mechanism.position).toBe(1);
    const c = await t.coach.call(mechanisms.POST, {
      params: params(),
      json: { name: 'Expectation', kind: 'non-specific', position: 0 },
    });
    expect(c.body.mechanism.position).toBe(0);
    const wb = await t.coach.call(one.GET, { params: params() });
    expect(wb.body.mechanisms.map((m: { name: string }) => m.name)).toEqual([
      'Expectation',
      'Neural drive',
      'Tendon stiffness',
    ]);
  });

  it('updates any subset', async () => {
    const res = await t.coach.call(mechanismOne.PATCH, {
      method: 'PATCH',
      params: params({ mechanismId: String(first) }),
      json: { prior: 0.7, summary: 'More motor units fire together.' },
    });
    expect(res.status).toBe(200);
    expect(res.body.mechanism).toMatchObject({
      id: first,
      prior: 0.7,
      summary: 'More motor units fire together.',
      name: 'Neural drive',
      stated: true,
    });
  });

  it('refuses bad input with a 400 and changes nothing', async () => {
    const before = await snapshot();
    const bad: [string, () => Promise<{ status: number; body: any }>, string][] = [
      [
        'prior of 1',
        () => t.coach.call(mechanisms.POST, { params: params(), json: { name: 'X mechanism', prior: 1 } }),
        'prior',
      ],
      ['no name', () => t.coach.call(mechanisms.POST, { params: params(), json: { kind: 'skill' } }), 'name'],
      [
        'unknown kind',
        () => t.coach.call(mechanisms.POST, { params: params(), json: { name: 'X mechanism', kind: 'magic' } }),
        'kind',
      ],
      [
        'intensity above 1',
        () => t.coach.call(mechanisms.POST, { params: params(), json: { name: 'X mechanism', minIntensity: 80 } }),
        'minIntensity',
      ],
      ['malformed JSON', () => t.coach.call(mechanisms.POST, { params: params(), rawBody: '{"name":' }), ''],
      ['an array', () => t.coach.call(mechanisms.POST, { params: params(), json: ['Neural drive'] }), ''],
      [
        'PATCH with nothing',
        () =>
          t.coach.call(mechanismOne.PATCH, {
            method: 'PATCH',
            params: params({ mechanismId: String(first) }),
            json: {},
          }),
        '',
      ],
      [
        'PATCH wrong type',
        () =>
          t.coach.call(mechanismOne.PATCH, {
            method: 'PATCH',
            params: params({ mechanismId: String(first) }),
            json: { stated: 'yes' },
          }),
        'stated',
      ],
      [
        'PATCH non-numeric id',
        () =>
          t.coach.call(mechanismOne.PATCH, {
            method: 'PATCH',
            params: params({ mechanismId: 'x' }),
            json: { prior: 0.2 },
          }),
        'mechanismId',
      ],
    ];
    for (const [label, run, path] of bad) {
      const res = await run();
      expect(res.status, label).toBe(400);
      expect(
        res.body.issues.map((i: { path: string }) => i.path),
        label,
      ).toContain(path);
    }
    expect(await snapshot()).toEqual(before);
  });

  it('lets only the author and the owner change them; other teams get 404, as does a mechanism of another review', async () => {
    const before = await snapshot();
    const json = { name: 'Not allowed' };
    expect((await t.coach2.call(mechanisms.POST, { params: params(), json })).status).toBe(403);
    expect((await t.reviewer.call(mechanisms.POST, { params: params(), json })).status).toBe(403);
    expect((await t.outsider.call(mechanisms.POST, { params: params(), json })).status).toBe(404);
    expect(
      (await t.coach2.call(mechanismOne.DELETE, { method: 'DELETE', params: params({ mechanismId: String(first) }) }))
        .status,
    ).toBe(403);
    expect(
      (
        await t.outsider.call(mechanismOne.PATCH, {
          method: 'PATCH',
          params: params({ mechanismId: String(first) }),
          json: { prior: 0.1 },
        })
      ).status,
    ).toBe(404);
    // Right review id in the path, mechanism of another review: not found.
    expect(
      (
        await t.coach.call(mechanismOne.PATCH, {
          method: 'PATCH',
          params: { id: String(otherReviewId), mechanismId: String(first) },
          json: { prior: 0.1 },
        })
      ).status,
    ).toBe(404);
    expect(await snapshot()).toEqual(before);
  });
});

describe('appraisals', () => {
  let neural: number;
  let tendon: number;
  let outcomeAppraisal: number;

  beforeAll(async () => {
    const wb = await t.coach.call(one.GET, { params: params() });
    neural = wb.body.mechanisms.find((m: { name: string }) => m.name === 'Neural drive').id;
    tendon = wb.body.mechanisms.find((m: { name: string }) => m.name === 'Tendon stiffness').id;
  });

  it('appraises a study for the outcome: certainty and applicability come from the scoring rules', async () => {
    const res = await t.coach.call(appraisals.POST, {
      params: params(),
      json: { studyId: s.sameRct, mechanismId: null, direction: 'supports', riskOfBias: 'serious' },
    });
    expect(res.status).toBe(201);
    // docs/scoring.md §1: a randomized trial starts at 4 (high); serious risk of bias −1 → 3, moderate.
    // §2: same training status, same health, same intensity (0.8 and 0.8) → 1.0 × 1.0.
    expect(res.body.appraisal).toMatchObject({
      reviewId,
      studyId: s.sameRct,
      mechanismId: null,
      direction: 'supports',
      riskOfBias: 'serious',
      inconsistency: 'none',
      largeEffect: 0,
      doseResponse: false,
      applicabilityOverride: null,
      overrideReason: null,
      notes: '',
      certainty: 'moderate',
      suggestedApplicability: 1,
      applicability: 1,
    });
    outcomeAppraisal = res.body.appraisal.id;
  });

  it('suggests applicability from population and dose: trained vs recreational 0.75 × dose 1 − |0.4 − 0.8| / 0.8 = 0.5 → 0.375', async () => {
    const res = await t.coach.call(appraisals.POST, {
      params: params(),
      json: { studyId: s.trainedHalfDose, mechanismId: neural, direction: 'supports', imprecision: 'very-serious' },
    });
    expect(res.status).toBe(201);
    expect(res.body.appraisal.suggestedApplicability).toBeCloseTo(0.375, 12);
    // 4 − 2 = 2: low.
    expect(res.body.appraisal.certainty).toBe('low');
  });

  it('counts injured vs healthy as one more level: elite injured vs recreational healthy = 3 levels → 0.5; a cohort rated up for a large effect', async () => {
    const res = await t.coach.call(appraisals.POST, {
      params: params(),
      json: { studyId: s.cohort, mechanismId: tendon, direction: 'against', largeEffect: 1, doseResponse: true },
    });
    expect(res.body.appraisal.suggestedApplicability).toBe(0.5);
    // docs/scoring.md §1: a cohort starts at 2; +1 large effect, +1 dose-response → 4, high.
    expect(res.body.appraisal.certainty).toBe('high');
  });

  it('keeps an override with its reason, and clearing the override clears the reason', async () => {
    const res = await t.coach.call(appraisalOne.PATCH, {
      method: 'PATCH',
      params: params({ appraisalId: String(outcomeAppraisal) }),
      json: { applicabilityOverride: 0.4, overrideReason: 'The trial used a different grip.' },
    });
    expect(res.body.appraisal).toMatchObject({
      applicabilityOverride: 0.4,
      overrideReason: 'The trial used a different grip.',
      suggestedApplicability: 1,
      applicability: 0.4,
    });
    const cleared = await t.coach.call(appraisalOne.PATCH, {
      method: 'PATCH',
      params: params({ appraisalId: String(outcomeAppraisal) }),
      json: { applicabilityOverride: null },
    });
    expect(cleared.body.appraisal).toMatchObject({
      applicabilityOverride: null,
      overrideReason: null,
      applicability: 1,
    });
  });

  it('refuses what the data rules out with a 400 or 409 and changes nothing', async () => {
    const before = await snapshot();
    const post = (json: Record<string, unknown>) => t.coach.call(appraisals.POST, { params: params(), json });
    const otherTeam = await post({ studyId: s.otherTeam, direction: 'supports' });
    expect(otherTeam.status).toBe(400);
    expect(otherTeam.body.issues[0].path).toBe('studyId');
    const missing = await post({ studyId: 999999, direction: 'supports' });
    // Another team's study gets exactly the answer of a missing one.
    expect(missing.body).toEqual(otherTeam.body);
    const noDesign = await post({ studyId: s.noDesign, direction: 'supports' });
    expect(noDesign.status).toBe(400);
    expect(noDesign.body.error).toMatch(/design/);
    const foreignMechanism = await t.coach.call(appraisals.POST, {
      params: { id: String(otherReviewId) },
      json: { studyId: s.sameRct, mechanismId: neural, direction: 'supports' },
    });
    expect(foreignMechanism.status).toBe(400);
    expect(foreignMechanism.body.issues[0].path).toBe('mechanismId');
    const twice = await post({ studyId: s.sameRct, mechanismId: null, direction: 'against' });
    expect(twice.status).toBe(409);
    const noReason = await post({
      studyId: s.sameRct,
      mechanismId: neural,
      direction: 'supports',
      applicabilityOverride: 0.2,
    });
    expect(noReason.status).toBe(400);
    expect(noReason.body.issues[0].path).toBe('overrideReason');
    const patchNoReason = await t.coach.call(appraisalOne.PATCH, {
      method: 'PATCH',
      params: params({ appraisalId: String(outcomeAppraisal) }),
      json: { applicabilityOverride: 0.3 },
    });
    expect(patchNoReason.status).toBe(400);
    expect(patchNoReason.body.issues).toEqual([{ path: 'overrideReason', message: expect.any(String) }]);
    for (const [label, json] of [
      ['wrong types', { studyId: 'one', direction: 'up', riskOfBias: 3 }],
      ['missing fields', {}],
      ['largeEffect 3', { studyId: s.sameRct, direction: 'supports', largeEffect: 3 }],
    ] as const) {
      const res = await post(json);
      expect(res.status, label).toBe(400);
    }
    expect((await t.coach.call(appraisals.POST, { params: params(), rawBody: 'not json' })).status).toBe(400);
    expect(await snapshot()).toEqual(before);
  });

  it('lets one of two identical appraisals sent at once in, and answers the other 409', async () => {
    const json = { studyId: s.sameRct, mechanismId: neural, direction: 'supports' };
    const [a, b] = await Promise.all([
      t.coach.call(appraisals.POST, { params: params(), json }),
      t.owner.call(appraisals.POST, { params: params(), json }),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    expect(await Appraisal.count({ where: { reviewId, studyId: s.sameRct, mechanismId: neural } })).toBe(1);
    const created = a.status === 201 ? a : b;
    await t.coach.call(appraisalOne.DELETE, {
      method: 'DELETE',
      params: params({ appraisalId: String(created.body.appraisal.id) }),
    });
  });

  it('lets only the author and the owner appraise; outsiders get 404', async () => {
    const before = await snapshot();
    const json = { studyId: s.sameRct, mechanismId: tendon, direction: 'neutral' };
    expect((await t.coach2.call(appraisals.POST, { params: params(), json })).status).toBe(403);
    expect((await t.reviewer.call(appraisals.POST, { params: params(), json })).status).toBe(403);
    expect((await t.athlete.call(appraisals.POST, { params: params(), json })).status).toBe(403);
    expect((await t.outsider.call(appraisals.POST, { params: params(), json })).status).toBe(404);
    expect(
      (
        await t.outsider.call(appraisalOne.DELETE, {
          method: 'DELETE',
          params: params({ appraisalId: String(outcomeAppraisal) }),
        })
      ).status,
    ).toBe(404);
    expect(
      (
        await t.coach2.call(appraisalOne.PATCH, {
          method: 'PATCH',
          params: params({ appraisalId: String(outcomeAppraisal) }),
          json: { notes: 'x' },
        })
      ).status,
    ).toBe(403);
    // An appraisal id of this review under another review's path: not found.
    expect(
      (
        await t.coach.call(appraisalOne.PATCH, {
          method: 'PATCH',
          params: { id: String(otherReviewId), appraisalId: String(outcomeAppraisal) },
          json: { notes: 'x' },
        })
      ).status,
    ).toBe(404);
    expect(await snapshot()).toEqual(before);
    expect((await t.owner.call(appraisals.POST, { params: params(), json })).status).toBe(201);
  });

  it('moves the cached verdict the dashboard shows', async () => {
    const list = await t.coach.call(reviews.GET, { path: `/api/reviews?teamId=${t.teamId}` });
    const mine = list.body.reviews.find((r: { id: number }) => r.id === reviewId);
    // By hand (docs/scoring.md §3–§5): W = 0.6·1 (outcome) + 0.3·0.375 (neural) + 1·0.5 + 0.6·1 (tendon) = 1.8125 ≥ 1;
    // P_outcome = logistic(0.6·ln 4) = 0.697 ≥ 0.66; stated "Neural drive": logistic(logit 0.7 + 0.3·0.375·ln 4) = 0.731 ≥ 0.66.
    expect(mine.verdict).toBe('supported');
    const other = list.body.reviews.find((r: { id: number }) => r.id === otherReviewId);
    expect(other.verdict).toBe('insufficient');
  });

  it('deletes an appraisal, and deleting a mechanism deletes its appraisals', async () => {
    const del = await t.coach.call(appraisalOne.DELETE, {
      method: 'DELETE',
      params: params({ appraisalId: String(outcomeAppraisal) }),
    });
    expect(del.status).toBe(200);
    expect(del.body.appraisal.id).toBe(outcomeAppraisal);
    expect(await Appraisal.count({ where: { id: outcomeAppraisal } })).toBe(0);
    const tendonAppraisals = await Appraisal.count({ where: { mechanismId: tendon } });
    expect(tendonAppraisals).toBe(2);
    const res = await t.coach.call(mechanismOne.DELETE, {
      method: 'DELETE',
      params: params({ mechanismId: String(tendon) }),
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ mechanism: { id: tendon, name: 'Tendon stiffness' }, deletedAppraisals: 2 });
    expect(await Appraisal.count({ where: { mechanismId: tendon } })).toBe(0);
  });
});

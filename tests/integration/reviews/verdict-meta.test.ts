import { beforeAll, describe, expect, it } from 'vitest';
import * as appraisals from '@/app/api/reviews/[id]/appraisals/route';
import * as meta from '@/app/api/reviews/[id]/meta-analysis/route';
import * as mechanisms from '@/app/api/reviews/[id]/mechanisms/route';
import * as verdict from '@/app/api/reviews/[id]/verdict/route';
import * as one from '@/app/api/reviews/[id]/route';
import * as reviews from '@/app/api/reviews/route';
import * as studies from '@/app/api/studies/route';
import { useTestApp } from '../../helpers/app';
import { makeTeam, newReview, type TeamFixture } from './helpers';

useTestApp();
let t: TeamFixture;
let reviewId: number;
let mechanismId: number;
let otherMechanismId: number;

const addStudy = async (title: string, effect: Record<string, unknown> | null, extra: Record<string, unknown> = {}) => {
  const res = await t.coach.call(studies.POST, {
    json: {
      teamId: t.teamId,
      title,
      year: 2020,
      design: 'randomized',
      population: 'recreational',
      intensity: 0.8,
      effect,
      ...extra,
    },
  });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  return res.body.studies[0].id as number;
};
const appraise = (studyId: number, mechanism: number | null, direction = 'supports') =>
  t.coach.call(appraisals.POST, {
    params: { id: String(reviewId) },
    // Pooling, not the direction, is under test: a reason covers a direction the effect does not suggest.
    json: { studyId, mechanismId: mechanism, direction, directionReason: 'Set by the test.' },
  });
const metaOf = (query: string, client = t.coach) =>
  client.call(meta.GET, { params: { id: String(reviewId) }, path: `/api/reviews/x/meta-analysis?${query}` });

/**
 * BCG vaccine trials (Colditz et al. 1994) as metafor's dat.bcg, [tpos, tneg, cpos, cneg]
 * (the same rows as tests/unit/stats/fixtures.ts). Real published data, used here only as a
 * reference data set for the pooling, through the whole route.
 */
const BCG = [
  [4, 119, 11, 128],
  [6, 300, 29, 274],
  [3, 228, 11, 209],
  [62, 13536, 248, 12619],
  [33, 5036, 47, 5761],
  [180, 1361, 372, 1079],
  [8, 2537, 10, 619],
  [505, 87886, 499, 87892],
  [29, 7470, 45, 7232],
  [17, 1699, 65, 1600],
  [186, 50448, 141, 27197],
  [5, 2493, 3, 2338],
  [27, 16886, 29, 17825],
];

beforeAll(async () => {
  t = await makeTeam('vm');
  reviewId = (await t.coach.call(reviews.POST, { json: newReview(t.teamId) })).body.review.id;
  mechanismId = (
    await t.coach.call(mechanisms.POST, {
      params: { id: String(reviewId) },
      json: { name: 'Tendon stiffening', stated: true, minIntensity: 0.9, minEffort: 'to-failure', magnitude: 'large' },
    })
  ).body.mechanism.id;
  otherMechanismId = (
    await t.coach.call(mechanisms.POST, { params: { id: String(reviewId) }, json: { name: 'Neural drive' } })
  ).body.mechanism.id;
});

describe('GET /api/reviews/:id/verdict', () => {
  it('returns the engine’s output with rows’ ids and names, the dose check, and each appraisal’s working', async () => {
    const sid = await addStudy('A randomized hang trial', null);
    await appraise(sid, null);
    await appraise(sid, mechanismId);
    const res = await t.reviewer.call(verdict.GET, { params: { id: String(reviewId) } });
    expect(res.status).toBe(200);
    const v = res.body;
    expect(Object.keys(v).sort()).toEqual([
      'appraisals',
      'dose',
      // The pooled outcome effect against the probability (docs/scoring.md §10); null here, no effect sizes.
      'effectCheck',
      'evidenceWeight',
      'label',
      'mechanisms',
      'outcome',
      'robustness',
      'steps',
      'verdict',
    ]);
    // One high-certainty, fully applicable supporting appraisal: odds × 4 → 0.8 (docs/scoring.md §3).
    expect(v.outcome.probability).toBeCloseTo(0.8, 12);
    expect(v.outcome.term).toBe('likely');
    expect(v.evidenceWeight).toBeCloseTo(2, 12);
    expect(v.mechanisms.map((m: { id: number; name: string }) => [m.id, m.name]).sort()).toEqual(
      [
        [mechanismId, 'Tendon stiffening'],
        [otherMechanismId, 'Neural drive'],
      ].sort(),
    );
    // The dose check (helpers.protocol: +10 kg on 70 kg with a +30 kg max, hard; 10 s × 6 sets × 2 sessions × 4 days).
    expect(v.dose).toMatchObject({
      protocolIntensity: expect.closeTo(0.8, 12),
      protocolEffort: 'hard',
      weeklySecondsUnderLoad: 480,
      spacing: { ok: true, hoursNeeded: 6 },
    });
    const tendon = v.dose.perMechanism.find((m: { id: number }) => m.id === mechanismId);
    // shortfall_I = (0.9 − 0.8) / 0.9; shortfall_E = (3 − 2) / 3; penalty = ln 20 × their sum (docs/scoring.md §3).
    expect(tendon.intensityShortfall).toBeCloseTo(0.1 / 0.9, 12);
    expect(tendon.effortShortfall).toBeCloseTo(1 / 3, 12);
    expect(tendon.dosePenalty).toBeCloseTo(Math.log(20) * (0.1 / 0.9 + 1 / 3), 12);
    const ranked = v.mechanisms.find((m: { id: number }) => m.id === mechanismId);
    expect(ranked.dosePenalty).toBeCloseTo(tendon.dosePenalty, 12);
    // logit p = logit 0.5 + ln 4 − penalty.
    expect(ranked.probability).toBeCloseTo(1 / (1 + Math.exp(-(Math.log(4) - tendon.dosePenalty))), 12);
    expect(v.appraisals).toHaveLength(2);
    expect(v.appraisals[0]).toMatchObject({
      certainty: 'high',
      certaintyScore: 4,
      overridden: false,
      applicability: 1,
    });
    expect(v.appraisals[0].certaintySteps[0]).toMatchObject({ domain: 'design', change: 4, score: 4 });
    expect(v.appraisals[0].logOddsTerm).toBeCloseTo(Math.log(4), 12);
    expect(v.steps.map((s: { kind: string }) => s.kind)).toContain('verdict');
    // The engine's working names mechanisms by name, not by row id.
    expect(v.steps.some((s: { text: string }) => s.text.includes('"Tendon stiffening"'))).toBe(true);
  });

  it('is 403 for an athlete, 404 for an outsider and for a missing review', async () => {
    expect((await t.athlete.call(verdict.GET, { params: { id: String(reviewId) } })).status).toBe(403);
    expect((await t.outsider.call(verdict.GET, { params: { id: String(reviewId) } })).status).toBe(404);
    expect((await t.coach.call(verdict.GET, { params: { id: '999999' } })).status).toBe(404);
    expect((await t.coach.call(verdict.GET, { params: { id: '0' } })).status).toBe(400);
  });
});

describe('GET /api/reviews/:id/meta-analysis', () => {
  it('answers 400 while fewer than two compatible effect sizes exist', async () => {
    const res = await metaOf('mechanism=outcome');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/at least two/);
    expect(res.body.issues).toEqual([{ path: 'mechanism', message: expect.any(String) }]);
  });

  it('reproduces Hedges’ g of the Borenstein et al. (2009, ch. 4) worked example through the route', async () => {
    // Borenstein, Hedges, Higgins & Rothstein (2009), Introduction to Meta-Analysis, ch. 4: means 103 vs 100,
    // SDs 5.5 and 4.5, n 50 each → d 0.5970, V_d 0.0418, J 0.9923, g 0.5924, V_g 0.0411.
    const a = await addStudy('Means study (Borenstein example)', {
      kind: 'means',
      m1: 103,
      sd1: 5.5,
      n1: 50,
      m2: 100,
      sd2: 4.5,
      n2: 50,
    });
    const b = await addStudy('A t-test study', { kind: 't', t: 2.5, n1: 20, n2: 20 });
    await appraise(a, otherMechanismId);
    await appraise(b, otherMechanismId);
    const res = await metaOf(`mechanism=${otherMechanismId}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ mechanismId: otherMechanismId, target: 'Neural drive', k: 2, measure: 'smd' });
    const row = res.body.studies.find((r: { studyId: number }) => r.studyId === a);
    expect(row.effectSize).toBeCloseTo(0.5924, 4);
    expect(row.variance).toBeCloseTo(0.0411, 4);
    expect(row.ciLow).toBeCloseTo(row.effectSize - 1.959964 * Math.sqrt(row.variance), 5);
    expect(row.ciHigh).toBeCloseTo(row.effectSize + 1.959964 * Math.sqrt(row.variance), 5);
    expect(row).toMatchObject({
      source: 'means',
      converted: false,
      direction: 'supports',
      citation: 'Means study (Borenstein example), 2020',
    });
    const weights = res.body.studies.map((r: { weight: number }) => r.weight);
    expect(weights.reduce((x: number, y: number) => x + y, 0)).toBeCloseTo(100, 9);
    expect(res.body.random.weights).toEqual(weights);
  });

  it('pools the 13 BCG trials as log risk ratios to the published fixed-effect and DerSimonian–Laird results', async () => {
    for (const [i, [a, b, c, d]] of BCG.entries()) {
      const sid = await addStudy(
        `BCG reference trial ${i + 1} (dat.bcg row ${i + 1})`,
        { kind: 'two-by-two', a, b, c, d, measure: 'risk-ratio' },
        { year: 1990 + i },
      );
      await appraise(sid, null);
    }
    const res = await metaOf('mechanism=outcome');
    expect(res.status).toBe(200);
    expect(res.body.measure).toBe('log-risk-ratio');
    expect(res.body.k).toBe(13);
    // metafor tests/testthat/test_misc_metan_vs_rma.uni_with_dat.bcg.r (checked there against Stata metan):
    // fixed −0.4303 [−0.5097, −0.3509]; DL −0.7141 [−1.0644, −0.3638], τ² 0.3088, I² 92.1173 %.
    expect(res.body.fixed.estimate).toBeCloseTo(-0.4303, 4);
    expect(res.body.fixed.ci[0]).toBeCloseTo(-0.5097, 4);
    expect(res.body.fixed.ci[1]).toBeCloseTo(-0.3509, 4);
    expect(res.body.random.estimate).toBeCloseTo(-0.7141, 4);
    expect(res.body.random.ci[0]).toBeCloseTo(-1.0644, 4);
    expect(res.body.random.tau2).toBeCloseTo(0.3088, 4);
    expect(res.body.random.I2).toBeCloseTo(92.1173, 3);
    // First trial: log RR = ln((4/123)/(11/139)) = −0.8893, v = 1/4 − 1/123 + 1/11 − 1/139 = 0.3256 (metafor escalc, dat.bcg).
    expect(res.body.studies[0].effectSize).toBeCloseTo(-0.8893, 4);
    expect(res.body.studies[0].variance).toBeCloseTo(0.3256, 4);
    // The outcome's earlier appraisal has no effect data: listed as excluded, with the reason.
    expect(res.body.excluded).toEqual([
      expect.objectContaining({ reason: 'The study has no effect data in the library.' }),
    ]);
  });

  it('never pools the two families together: SMDs are pooled on request, risk ratios listed as excluded', async () => {
    const x = await addStudy('Odds-ratio study', {
      kind: 'two-by-two',
      a: 12,
      b: 8,
      c: 6,
      d: 14,
      measure: 'odds-ratio',
    });
    const y = await addStudy('Ready SMD study', { kind: 'ready', effectSize: 0.3, variance: 0.05, measure: 'smd' });
    await appraise(x, null);
    await appraise(y, null);
    const res = await metaOf('mechanism=outcome&measure=smd');
    expect(res.status).toBe(200);
    expect(res.body.k).toBe(2);
    const converted = res.body.studies.find((r: { studyId: number }) => r.studyId === x);
    // ln OR = ln(12·14 / (8·6)) = 1.2528; × √3/π (Borenstein et al. 2009, ch. 7) = 0.6907.
    expect(converted.effectSize).toBeCloseTo(Math.log((12 * 14) / (8 * 6)) * (Math.sqrt(3) / Math.PI), 12);
    expect(converted.converted).toBe(true);
    expect(res.body.excluded.filter((e: { reason: string }) => /risk ratio/.test(e.reason))).toHaveLength(13);
    // Without a choice, the larger family (13 risk ratios) is pooled, and the workbench offers both targets.
    expect((await metaOf('mechanism=outcome')).body.measure).toBe('log-risk-ratio');
    const wb = await t.coach.call(one.GET, { params: { id: String(reviewId) } });
    expect(wb.body.poolable).toEqual(
      expect.arrayContaining([
        { mechanismId: null, measure: 'log-risk-ratio', k: 13 },
        { mechanismId: otherMechanismId, measure: 'smd', k: 2 },
      ]),
    );
  });

  it('refuses bad queries (400), another review’s mechanism (404), athletes (403) and outsiders (404)', async () => {
    expect((await metaOf('')).status).toBe(400);
    expect((await metaOf('mechanism=tendon')).status).toBe(400);
    expect((await metaOf('mechanism=outcome&measure=hazard')).status).toBe(400);
    const otherReview = (await t.coach.call(reviews.POST, { json: newReview(t.teamId) })).body.review.id;
    const res = await t.coach.call(meta.GET, {
      params: { id: String(otherReview) },
      path: `/x?mechanism=${otherMechanismId}`,
    });
    expect(res.status).toBe(404);
    expect((await metaOf('mechanism=outcome', t.athlete)).status).toBe(403);
    expect((await metaOf('mechanism=outcome', t.outsider)).status).toBe(404);
  });
});

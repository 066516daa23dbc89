import { describe, expect, it } from 'vitest';
import { appraisalLogOdds, logistic, logit, scoreMechanism, type MechanismInput } from '@/lib/scoring/mechanism';
import { ScoringInputError } from '@/lib/scoring/errors';
import type { Appraisal } from '@/lib/scoring/types';
import { formatNumber } from '@/lib/scoring/format';

// Model: docs/scoring.md §3 and precise rules (our model). Magnitudes: Cohen (1988) benchmarks for a
// standardized mean difference, small 0.2 / medium 0.5 / large 0.8.

const LN4 = Math.log(4);
const LN20 = Math.log(20);
const sigmoid = (x: number) => 1 / (1 + Math.exp(-x));
const A = (direction: Appraisal['direction'], certainty: Appraisal['certainty'], applicability = 1): Appraisal => ({
  direction,
  certainty,
  applicability,
});

describe('scoreMechanism — log-odds updating', () => {
  it('with no evidence and no prior returns the default prior 0.5', () => {
    const r = scoreMechanism({ evidence: [] });
    expect(r.probability).toBe(0.5);
    expect(r.logOdds).toBe(0);
    expect(r.term).toBe('about as likely as not');
  });

  it('one fully applicable high-certainty supporting study multiplies the odds by 4', () => {
    const r = scoreMechanism({ evidence: [A('supports', 'high')] });
    expect(r.probability).toBeCloseTo(0.8, 15);
    expect(r.logOdds).toBeCloseTo(LN4, 15);
  });

  it.each([
    ['high', 1.0],
    ['moderate', 0.6],
    ['low', 0.3],
    ['very-low', 0.1],
  ] as const)('weights %s certainty by %s', (certainty, w) => {
    expect(scoreMechanism({ evidence: [A('supports', certainty)] }).logOdds).toBeCloseTo(w * LN4, 14);
    expect(scoreMechanism({ evidence: [A('against', certainty)] }).logOdds).toBeCloseTo(-w * LN4, 14);
    expect(scoreMechanism({ evidence: [A('neutral', certainty)] }).logOdds).toBe(0);
  });

  it('scales each term by applicability', () => {
    const r = scoreMechanism({ evidence: [A('supports', 'moderate', 0.5), A('against', 'low', 0.25)] });
    expect(r.logOdds).toBeCloseTo((0.6 * 0.5 - 0.3 * 0.25) * LN4, 14);
    expect(r.probability).toBeCloseTo(sigmoid((0.6 * 0.5 - 0.3 * 0.25) * LN4), 14);
  });

  it('starts from the prior', () => {
    const r = scoreMechanism({ prior: 0.2, evidence: [A('supports', 'high')] });
    // odds 0.25 × 4 = 1
    expect(r.probability).toBeCloseTo(0.5, 14);
  });

  it.each([
    [0.001, 0.01],
    [0.01, 0.01],
    [0.5, 0.5],
    [0.99, 0.99],
    [0.9999, 0.99],
  ])('clamps prior %s to %s', (prior, used) => {
    const r = scoreMechanism({ prior, evidence: [] });
    expect(r.prior).toBe(used);
    expect(r.probability).toBe(used);
  });

  it.each([[0], [1], [-0.2], [1.5], [Number.NaN]])('rejects prior %s (outside (0, 1))', (prior) => {
    expect(() => scoreMechanism({ prior, evidence: [] })).toThrow(ScoringInputError);
  });

  it('keeps the prior exactly on a band edge when nothing is added', () => {
    expect(scoreMechanism({ prior: 0.66, evidence: [] }).term).toBe('likely');
    expect(scoreMechanism({ prior: 0.33, evidence: [A('neutral', 'high')] }).probability).toBe(0.33);
  });

  it('never lets rounding push a tiny supporting (opposing) appraisal below (above) the prior', () => {
    // ln and exp do not round-trip: e.g. 1 / (1 + e^−logit(0.9)) < 0.9 in double precision.
    for (let i = 1; i < 100; i += 1) {
      const prior = i / 100;
      const up = scoreMechanism({ prior, evidence: [A('supports', 'very-low', 1e-17)] });
      const down = scoreMechanism({ prior, evidence: [A('against', 'very-low', 1e-17)] });
      expect(up.probability).toBeGreaterThanOrEqual(prior);
      expect(down.probability).toBeLessThanOrEqual(prior);
    }
  });

  it('stays strictly inside (0, 1) under overwhelming evidence', () => {
    const up = scoreMechanism({ evidence: Array.from({ length: 5000 }, () => A('supports', 'high')) });
    const down = scoreMechanism({ evidence: Array.from({ length: 5000 }, () => A('against', 'high')) });
    expect(up.probability).toBeLessThan(1);
    expect(up.term).toBe('virtually certain');
    expect(down.probability).toBeGreaterThan(0);
    expect(down.term).toBe('exceptionally unlikely');
    expect(up.steps.find((s) => s.kind === 'probability')?.text).toContain('held a hair inside');
  });
});

describe('scoreMechanism — dose and effort penalties', () => {
  it.each([
    // minIntensity, protocolIntensity, intensity shortfall
    [0.8, 0.4, 0.5],
    [0.8, 0.8, 0],
    [0.8, 1, 0], // above the minimum: no bonus
    [0.5, 0, 1],
    [0.7, 0.3, 4 / 7],
  ])(
    'intensity: minimum %s, protocol %s → shortfall %s, penalty ln 20 × shortfall',
    (minIntensity, protocolIntensity, shortfall) => {
      const r = scoreMechanism({ evidence: [], minIntensity, protocolIntensity });
      expect(r.shortfall.intensity).toBeCloseTo(shortfall, 14);
      expect(r.dosePenalty).toBeCloseTo(LN20 * shortfall, 14);
      expect(r.logOdds).toBeCloseTo(-LN20 * shortfall, 14);
    },
  );

  it.each([
    ['hard', 'easy', 2 / 3],
    ['to-failure', 'easy', 1],
    ['to-failure', 'moderate', 2 / 3],
    ['to-failure', 'hard', 1 / 3],
    ['moderate', 'easy', 1 / 3],
    ['hard', 'hard', 0],
    ['hard', 'to-failure', 0],
    ['easy', 'easy', 0],
  ] as const)('effort: minimum %s, protocol %s → shortfall %s', (minEffort, protocolEffort, shortfall) => {
    const r = scoreMechanism({ evidence: [], minEffort, protocolEffort });
    expect(r.shortfall.effort).toBeCloseTo(shortfall, 14);
    expect(r.dosePenalty).toBeCloseTo(LN20 * shortfall, 14);
  });

  it('adds the intensity and effort shortfalls', () => {
    const r = scoreMechanism({
      evidence: [A('supports', 'high')],
      minIntensity: 0.7,
      protocolIntensity: 0.3,
      minEffort: 'hard',
      protocolEffort: 'easy',
    });
    const penalty = LN20 * (4 / 7 + 2 / 3);
    expect(r.dosePenalty).toBeCloseTo(penalty, 14);
    expect(r.logOdds).toBeCloseTo(LN4 - penalty, 14);
    expect(r.probability).toBeCloseTo(sigmoid(LN4 - penalty), 14);
  });

  it.each([
    [{ minIntensity: 0.8 }],
    [{ protocolIntensity: 0.2 }],
    [{ minEffort: 'to-failure' }],
    [{ protocolEffort: 'easy' }],
    [{ minIntensity: 0, protocolIntensity: 0.2 }],
    [{}],
  ] as const)('has no penalty without both a minimum and a protocol value: %o', (extra) => {
    const r = scoreMechanism({ evidence: [], ...(extra as Partial<MechanismInput>) });
    expect(r.dosePenalty).toBe(0);
    expect(r.probability).toBe(0.5);
  });
});

describe('scoreMechanism — expected contribution (Cohen 1988 magnitudes)', () => {
  it.each([
    ['none', 0],
    ['small', 0.2],
    ['moderate', 0.5],
    ['large', 0.8],
  ] as const)('magnitude %s multiplies p by %s', (magnitude, m) => {
    const r = scoreMechanism({ evidence: [A('supports', 'high')], magnitude });
    expect(r.expectedContribution).toBeCloseTo(0.8 * m, 14);
  });

  it("defaults magnitude to 'moderate'", () => {
    const r = scoreMechanism({ evidence: [] });
    expect(r.magnitude).toBe('moderate');
    expect(r.expectedContribution).toBe(0.25);
  });
});

describe('scoreMechanism — working steps a person can redo by hand', () => {
  const input: MechanismInput = {
    prior: 0.4,
    evidence: [
      A('supports', 'high', 0.75),
      A('supports', 'high', 0.5),
      A('against', 'moderate', 1),
      A('neutral', 'low', 1),
      A('supports', 'very-low', 0.2),
    ],
    minIntensity: 0.6,
    protocolIntensity: 0.45,
    minEffort: 'hard',
    protocolEffort: 'moderate',
    magnitude: 'large',
  };
  const r = scoreMechanism(input);

  it('groups evidence by direction × certainty, each term = sign × weight × Σ applicability × ln 4', () => {
    const evidence = r.steps.filter((s) => s.kind === 'evidence');
    expect(evidence.map((s) => [s.values.count, s.values.sign, s.values.weight, s.values.applicabilitySum])).toEqual([
      [2, 1, 1, 1.25],
      [1, 1, 0.1, 0.2],
      [1, -1, 0.6, 1],
      [1, 0, 0.3, undefined],
    ]);
    for (const s of evidence.slice(0, 3)) {
      expect(s.values.term).toBeCloseTo(s.values.sign * s.values.weight * s.values.applicabilitySum * LN4, 14);
    }
    expect(evidence[0].text).toBe(
      '2 supporting appraisals of high certainty: +1 × weight 1 × applicability 1.25 (summed) × ln 4 (1.3863) = +1.7329.',
    );
  });

  it('adds prior, evidence and penalty to the stated log-odds and probability', () => {
    const prior = r.steps.find((s) => s.kind === 'prior')!;
    const terms = r.steps.filter((s) => s.kind === 'evidence').reduce((sum, s) => sum + s.values.term, 0);
    const dose = r.steps.find((s) => s.kind === 'dose')!;
    const result = r.steps.find((s) => s.kind === 'probability')!;
    expect(prior.values.logOdds).toBeCloseTo(Math.log(0.4 / 0.6), 14);
    expect(dose.values.intensityShortfall).toBeCloseTo(0.25, 14);
    expect(dose.values.effortShortfall).toBeCloseTo(1 / 3, 14);
    const logOdds = prior.values.logOdds + terms - dose.values.dosePenalty;
    expect(result.values.logOdds).toBeCloseTo(logOdds, 14);
    expect(r.logOdds).toBeCloseTo(logOdds, 14);
    expect(r.probability).toBeCloseTo(sigmoid(logOdds), 14);
    expect(result.text.endsWith(`: ${r.term}.`)).toBe(true);
    expect(result.text).toContain(`= ${formatNumber(r.probability)}`);
    expect(dose.text).toBe(
      'Intensity shortfall max(0, (0.6 − 0.45) / 0.6) = 0.25; effort shortfall max(0, (2 hard − 1 moderate) / 3) = 0.3333. ' +
        'Dose penalty ln 20 × (0.25 + 0.3333) = 1.7475.',
    );
    const contribution = r.steps.find((s) => s.kind === 'contribution')!;
    expect(contribution.values.expectedContribution).toBeCloseTo(r.probability * 0.8, 14);
  });

  it('counts every appraisal toward its evidence weight, neutral ones included', () => {
    expect(r.evidenceWeight).toBeCloseTo(1 * 1.25 + 0.1 * 0.2 + 0.6 * 1 + 0.3 * 1, 14);
  });

  it('says so when there are no appraisals', () => {
    expect(scoreMechanism({ evidence: [] }).steps.some((s) => s.text.startsWith('No appraisals'))).toBe(true);
  });
});

describe('logit, logistic and appraisalLogOdds', () => {
  it('are inverse to each other', () => {
    expect(logistic(logit(0.3))).toBeCloseTo(0.3, 15);
    expect(logit(0.8)).toBeCloseTo(LN4, 15);
  });

  it('give one appraisal its term', () => {
    expect(appraisalLogOdds(A('supports', 'high'))).toBeCloseTo(LN4, 15);
    expect(appraisalLogOdds(A('against', 'low', 0.5))).toBeCloseTo(-0.3 * 0.5 * LN4, 15);
    expect(appraisalLogOdds(A('neutral', 'high'))).toBe(0);
  });

  it('reject bad input', () => {
    expect(() => logit(0)).toThrow(ScoringInputError);
    expect(() => logistic(Number.NaN)).toThrow(ScoringInputError);
    expect(() =>
      appraisalLogOdds({ direction: 'up', certainty: 'high', applicability: 1 } as unknown as Appraisal),
    ).toThrow(ScoringInputError);
  });
});

describe('scoreMechanism — bad input', () => {
  it.each([
    [{ evidence: [{ direction: 'for', certainty: 'high', applicability: 1 }] }, 'mechanism.evidence[0].direction'],
    [
      { evidence: [A('supports', 'high'), { direction: 'supports', certainty: 'medium', applicability: 1 }] },
      'mechanism.evidence[1].certainty',
    ],
    [
      { evidence: [{ direction: 'supports', certainty: 'high', applicability: 1.5 }] },
      'mechanism.evidence[0].applicability',
    ],
    [
      { evidence: [{ direction: 'supports', certainty: 'high', applicability: -0.1 }] },
      'mechanism.evidence[0].applicability',
    ],
    [
      { evidence: [{ direction: 'supports', certainty: 'high', applicability: Number.NaN }] },
      'mechanism.evidence[0].applicability',
    ],
    [{ evidence: [{ direction: 'supports', certainty: 'high' }] }, 'mechanism.evidence[0].applicability'],
    [
      { evidence: [{ direction: 'constructor', certainty: 'high', applicability: 1 }] },
      'mechanism.evidence[0].direction',
    ],
    [
      { evidence: [{ direction: 'supports', certainty: 'toString', applicability: 1 }] },
      'mechanism.evidence[0].certainty',
    ],
    [{ evidence: [null] }, 'mechanism.evidence[0]'],
    [{ evidence: 'none' }, 'mechanism.evidence'],
    [{}, 'mechanism.evidence'],
    [{ evidence: [], minIntensity: 1.1 }, 'mechanism.minIntensity'],
    [{ evidence: [], protocolIntensity: -1 }, 'mechanism.protocolIntensity'],
    [{ evidence: [], minEffort: 'max' }, 'mechanism.minEffort'],
    [{ evidence: [], protocolEffort: 'to failure' }, 'mechanism.protocolEffort'],
    [{ evidence: [], magnitude: 'huge' }, 'mechanism.magnitude'],
  ])('rejects %o at %s', (input, field) => {
    expect(() => scoreMechanism(input as unknown as MechanismInput)).toThrow(
      expect.objectContaining({ name: 'ScoringInputError', field }),
    );
  });
});

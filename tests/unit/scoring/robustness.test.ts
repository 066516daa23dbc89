import { describe, expect, it } from 'vitest';
import { robustness, withoutStudies } from '@/lib/scoring/robustness';
import { scoreReview, type ReviewInput } from '@/lib/scoring/verdict';
import { ScoringInputError } from '@/lib/scoring/errors';
import type { Appraisal } from '@/lib/scoring/types';

// Robustness of a verdict: docs/scoring.md §9 (our model). Every expected number below is worked
// out by hand in the comment beside it from §3–§5; the worked example of §9 is the first block.

const A = (
  studyId: string | undefined,
  direction: Appraisal['direction'],
  certainty: Appraisal['certainty'] = 'high',
  applicability = 1,
): Appraisal =>
  studyId === undefined ? { direction, certainty, applicability } : { studyId, direction, certainty, applicability };

/** The worked example of docs/scoring.md §9. */
const example: ReviewInput = {
  protocol: {},
  outcome: { evidence: [A('S1', 'supports'), A('S2', 'supports', 'moderate'), A('S3', 'against', 'low')] },
  mechanisms: [{ id: 'M1', stated: true, evidence: [A('S1', 'supports')] }],
};

describe('robustness — the worked example of docs/scoring.md §9', () => {
  const result = robustness(example);

  it('keeps the verdict of scoreReview', () => {
    // E = 1.3·ln 4, P = σ(1.8022) = 0.8584; M1 p = 0.8; W = 2.9 → supported (§9 example).
    expect(result.verdict).toBe('supported');
    expect(result.verdict).toBe(scoreReview(example).verdict);
  });

  it('leaves each study out of the outcome and every mechanism, in study order', () => {
    expect(result.leaveOneOut.map((r) => r.studyId)).toEqual(['S1', 'S2', 'S3']);
    const [s1, s2, s3] = result.leaveOneOut;
    // Without S1 (outcome and M1): W = 0.6 + 0.3 = 0.9 < 1 → insufficient; E = 0.3·ln 4 → P = 0.6025.
    expect(s1).toMatchObject({ verdict: 'insufficient', changed: true });
    expect(s1.outcomeProbability).toBeCloseTo(4 ** 0.3 / (1 + 4 ** 0.3), 12);
    // Without S2: E = 0.7·ln 4, P = 0.7252, W = 2.3 → still supported (§9 example).
    expect(s2).toMatchObject({ verdict: 'supported', changed: false });
    expect(s2.outcomeProbability).toBeCloseTo(0.7252, 4);
    // Without S3: E = 1.6·ln 4 → P = 4^1.6 / (1 + 4^1.6) = 0.9019, W = 2.6 → supported.
    expect(s3).toMatchObject({ verdict: 'supported', changed: false });
    expect(s3.outcomeProbability).toBeCloseTo(4 ** 1.6 / (1 + 4 ** 1.6), 12);
  });

  it('names S1 as pivotal and the fragility 1', () => {
    expect(result.pivotal).toEqual(['S1']);
    expect(result.fragility).toBe(1);
    expect(result.fragileSet).toEqual(['S1']);
  });

  it('gives the outcome prior range in closed form', () => {
    // low = σ(logit(0.66) − 1.3·ln 4) = 0.2425 (§9 example): odds 0.66/0.34 divided by 4^1.3.
    const odds = 0.66 / 0.34 / 4 ** 1.3;
    expect(result.outcomePriorRange.low).toBeCloseTo(odds / (1 + odds), 12);
    expect(result.outcomePriorRange.low).toBeCloseTo(0.2425, 4);
    expect(result.outcomePriorRange.high).toBe(0.99);
  });

  it('gives the mechanism prior range of its likelihood term', () => {
    // M1: L = ln 4, p = 0.8 is "likely" [0.66, 0.9). The prior landing on 0.66: odds 0.66/0.34/4,
    // p = 0.66 / (0.66 + 1.36) = 0.3267; on 0.9: odds 9/4, p = 9/13 = 0.6923.
    const [m1] = result.mechanismPriorRanges;
    expect(m1.id).toBe('M1');
    expect(m1.low).toBeCloseTo(0.66 / 2.02, 12);
    expect(m1.high).toBeCloseTo(9 / 13, 12);
  });

  it('shifts every appraisal one certainty level, the outcome first', () => {
    expect(result.certaintyShifts.map((s) => `${s.owner}:${s.index}`)).toEqual([
      'outcome:0',
      'outcome:1',
      'outcome:2',
      'M1:0',
    ]);
    // Outcome S1 high → moderate: E = 0.9·ln 4, P = 0.7770, W = 2.5 → supported; "up" stays high.
    // M1 high → moderate: p = 4^0.6 / (1 + 4^0.6) = 0.6967 ≥ 0.66 → supported.
    expect(result.certaintyShifts.every((s) => s.down === 'supported' && s.up === 'supported')).toBe(true);
  });
});

describe('robustness — more cases worked by hand (docs/scoring.md §3–§5, §9)', () => {
  it('finds the certainty call a verdict hangs on', () => {
    // Outcome S1 supports high: P = 0.8, W = 1. M1 stated, S1 supports moderate: p = 4^0.6 / (1 + 4^0.6) = 0.6967,
    // W = 1.6 → supported. M1's appraisal one level down (low): p = 4^0.3 / (1 + 4^0.3) = 0.6025
    // < 0.66 → other-reasons. The outcome's one level down (moderate): P = 0.6967, W = 1.2 → supported.
    const input: ReviewInput = {
      protocol: {},
      outcome: { evidence: [A('S1', 'supports')] },
      mechanisms: [{ id: 'M1', stated: true, evidence: [A('S1', 'supports', 'moderate')] }],
    };
    const result = robustness(input);
    expect(result.verdict).toBe('supported');
    expect(result.certaintyShifts).toEqual([
      { owner: 'outcome', index: 0, down: 'supported', up: 'supported' },
      { owner: 'M1', index: 0, down: 'other-reasons', up: 'supported' },
    ]);
  });

  it('needs two studies together: fragility 2, the first pair in study order', () => {
    // Three supporting high-certainty studies at applicability 0.6, no mechanism: W = 1.8,
    // P = 4^1.8 / (1 + 4^1.8) = 0.924 → other-reasons. One out: W = 1.2, P = 0.841 → unchanged.
    // Two out: W = 0.6 → insufficient; the first pair is (S1, S2).
    const input: ReviewInput = {
      protocol: {},
      outcome: { evidence: ['S1', 'S2', 'S3'].map((id) => A(id, 'supports', 'high', 0.6)) },
      mechanisms: [],
    };
    const result = robustness(input);
    expect(result.verdict).toBe('other-reasons');
    expect(result.pivotal).toEqual([]);
    expect(result.fragility).toBe(2);
    expect(result.fragileSet).toEqual(['S1', 'S2']);
  });

  it('has no fragility when no study or pair changes the verdict, or when there is no study', () => {
    // Five supporting high-certainty studies: any three left give W = 3, P = 64/65 → other-reasons.
    const five: ReviewInput = {
      protocol: {},
      outcome: { evidence: ['a', 'b', 'c', 'd', 'e'].map((id) => A(id, 'supports')) },
      mechanisms: [],
    };
    expect(robustness(five)).toMatchObject({ verdict: 'other-reasons', fragility: null, fragileSet: null });
    const empty = robustness({ protocol: {}, outcome: { evidence: [] }, mechanisms: [] });
    expect(empty).toMatchObject({
      verdict: 'insufficient',
      leaveOneOut: [],
      pivotal: [],
      fragility: null,
      fragileSet: null,
      outcomePriorRange: { low: 0.01, high: 0.99 },
      certaintyShifts: [],
    });
  });

  it('keys an appraisal without a study id by its list and position', () => {
    const input: ReviewInput = {
      protocol: {},
      outcome: { evidence: [A(undefined, 'supports'), A('S9', 'supports')] },
      mechanisms: [{ id: 'M1', evidence: [A(undefined, 'against', 'low')] }],
    };
    expect(robustness(input).leaveOneOut.map((r) => r.studyId)).toEqual(['outcome#0', 'S9', 'M1#0']);
  });

  it('bounds a not-supported verdict above', () => {
    // One opposing high-certainty study: P = 0.2, W = 1 → not-supported. The prior that lands on
    // 0.33: odds 0.33/0.67 × 4, p = 1.32 / (0.67 + 1.32) = 0.6633.
    const result = robustness({ protocol: {}, outcome: { evidence: [A('S1', 'against')] }, mechanisms: [] });
    expect(result.verdict).toBe('not-supported');
    expect(result.outcomePriorRange.low).toBe(0.01);
    expect(result.outcomePriorRange.high).toBeCloseTo(1.32 / 1.99, 12);
  });

  it('bounds an uncertain verdict on both sides and a default mechanism by its band', () => {
    // No outcome evidence and a neutral appraisal worth W = 1: P = 0.5 → uncertain; with E = 0 the
    // prior is the probability, so the range is exactly [0.33, 0.66]. M1 with no evidence: p = 0.5,
    // band "about as likely as not" [0.33, 0.66).
    const result = robustness({
      protocol: {},
      outcome: { evidence: [A('S1', 'neutral')] },
      mechanisms: [{ id: 'M1', evidence: [] }],
    });
    expect(result.verdict).toBe('uncertain');
    expect(result.outcomePriorRange).toEqual({ low: 0.33, high: 0.66 });
    expect(result.mechanismPriorRanges).toEqual([{ id: 'M1', low: 0.33, high: 0.66 }]);
  });

  it('clamps a bound that falls outside 0.01…0.99', () => {
    // Ten supporting high-certainty studies: E = 10·ln 4, so σ(logit(0.66) − E) ≈ 1.9e-6 → 0.01.
    const result = robustness({
      protocol: {},
      outcome: { evidence: Array.from({ length: 10 }, (_, i) => A(`S${i}`, 'supports')) },
      mechanisms: [],
    });
    expect(result.outcomePriorRange).toEqual({ low: 0.01, high: 0.99 });
  });

  it('counts the dose penalty in a mechanism range', () => {
    // M1 needs intensity 0.8, the protocol gives 0.4: penalty ln 20 × 0.5 = ln √20, so L = −ln √20
    // and p = 1 / (1 + √20) = 0.1827, "unlikely" [0.10, 0.33). The prior landing on 0.33:
    // odds 0.33/0.67 × √20 → p = 0.6877; on 0.10: odds 1/9 × √20 → 0.3319.
    const result = robustness({
      protocol: { intensity: 0.4 },
      outcome: { evidence: [] },
      mechanisms: [{ id: 'M1', minIntensity: 0.8, evidence: [] }],
    });
    const s = Math.sqrt(20);
    const at = (odds: number) => odds / (1 + odds);
    expect(result.mechanismPriorRanges[0].low).toBeCloseTo(at(s / 9), 12);
    expect(result.mechanismPriorRanges[0].high).toBeCloseTo(at((0.33 / 0.67) * s), 12);
  });

  it('refuses a study id that is not a non-empty string', () => {
    const bad = { protocol: {}, outcome: { evidence: [{ ...A(undefined, 'supports'), studyId: '' }] }, mechanisms: [] };
    expect(() => robustness(bad)).toThrow(ScoringInputError);
    expect(() => robustness(bad)).toThrow('outcome.evidence[0].studyId');
  });

  it('drops every appraisal of a study with withoutStudies, keeping the keys of the rest', () => {
    const smaller = withoutStudies(example, ['S1']);
    expect(smaller.outcome.evidence.map((a) => a.studyId)).toEqual(['S2', 'S3']);
    expect(smaller.mechanisms[0].evidence).toEqual([]);
    expect(scoreReview(smaller).verdict).toBe(robustness(example).leaveOneOut[0].verdict);
  });
});

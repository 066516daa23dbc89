import { describe, expect, it } from 'vitest';
import { scoreReview, type ReviewInput, type ReviewMechanismInput } from '@/lib/scoring/verdict';
import { ScoringInputError } from '@/lib/scoring/errors';
import type { Appraisal } from '@/lib/scoring/types';

// Verdict table, evidence weight, ranking and shares: docs/scoring.md §5 and precise rules (our model).

const LN4 = Math.log(4);
const LN20 = Math.log(20);
const A = (
  direction: Appraisal['direction'],
  certainty: Appraisal['certainty'] = 'high',
  applicability = 1,
): Appraisal => ({
  direction,
  certainty,
  applicability,
});
const review = (
  outcome: ReviewInput['outcome'],
  mechanisms: ReviewMechanismInput[] = [],
  protocol: ReviewInput['protocol'] = {},
): ReviewInput => ({ protocol, outcome, mechanisms });

describe('scoreReview — verdict table, first row that holds', () => {
  it.each([
    // [description, input, verdict, label]
    [
      'W < 1 → insufficient, whatever P_outcome is',
      review({ evidence: [A('supports', 'high', 0.99)] }, [{ id: 'm', stated: true, prior: 0.9, evidence: [] }]),
      'insufficient',
      'Not enough evidence',
    ],
    [
      'P_outcome < 0.33 → not-supported',
      review({ evidence: [A('against')] }), // odds 1/4 → 0.2
      'not-supported',
      'Does not hold up',
    ],
    [
      '0.33 ≤ P_outcome < 0.66 → uncertain',
      review({ evidence: [A('supports'), A('against')] }), // 0.5
      'uncertain',
      'Unsettled',
    ],
    [
      'P_outcome ≥ 0.66 and a stated mechanism p ≥ 0.66 → supported',
      review({ evidence: [A('supports')] }, [{ id: 'm', stated: true, evidence: [A('supports')] }]),
      'supported',
      'Holds up',
    ],
    [
      'P_outcome ≥ 0.66 but the stated mechanism p < 0.66 → other-reasons',
      review({ evidence: [A('supports')] }, [
        { id: 'stated', stated: true, evidence: [A('against')] },
        { id: 'other', evidence: [A('supports')] },
      ]),
      'other-reasons',
      'Works, but not for the stated reason',
    ],
    [
      'P_outcome ≥ 0.66 with no mechanism marked stated → other-reasons',
      review({ evidence: [A('supports')] }, [{ id: 'strong', evidence: [A('supports'), A('supports')] }]),
      'other-reasons',
      'Works, but not for the stated reason',
    ],
    [
      'P_outcome ≥ 0.66 with no mechanisms at all → other-reasons',
      review({ evidence: [A('supports')] }),
      'other-reasons',
      'Works, but not for the stated reason',
    ],
  ] as const)('%s', (_description, input, verdict, label) => {
    const result = scoreReview(input);
    expect(result.verdict).toBe(verdict);
    expect(result.label).toBe(label);
  });

  it('is supported when any one of several stated mechanisms holds', () => {
    const result = scoreReview(
      review({ evidence: [A('supports')] }, [
        { id: 'a', stated: true, evidence: [A('against')] },
        { id: 'b', stated: true, evidence: [A('supports')] },
      ]),
    );
    expect(result.verdict).toBe('supported');
  });

  describe('edges (a value on an edge belongs to the higher row)', () => {
    const neutral = A('neutral'); // W = 1 exactly, no change to any probability
    it.each([
      [0.33, 'uncertain'],
      [0.3299, 'not-supported'],
      [0.66, 'other-reasons'],
      [0.6599, 'uncertain'],
    ] as const)('P_outcome = %s → %s', (prior, verdict) => {
      const result = scoreReview(review({ prior, evidence: [neutral] }));
      expect(result.outcome.probability).toBe(prior);
      expect(result.evidenceWeight).toBe(1);
      expect(result.verdict).toBe(verdict);
    });

    it('W = 1 exactly is enough evidence', () => {
      expect(scoreReview(review({ evidence: [A('supports', 'high', 1)] })).verdict).not.toBe('insufficient');
    });

    it('a stated mechanism at exactly p = 0.66 holds', () => {
      const result = scoreReview(
        review({ evidence: [A('supports')] }, [{ id: 'm', stated: true, prior: 0.66, evidence: [] }]),
      );
      expect(result.mechanisms[0].probability).toBe(0.66);
      expect(result.verdict).toBe('supported');
    });

    it('a stated mechanism just below 0.66 does not', () => {
      const result = scoreReview(
        review({ evidence: [A('supports')] }, [{ id: 'm', stated: true, prior: 0.6599, evidence: [] }]),
      );
      expect(result.verdict).toBe('other-reasons');
    });
  });
});

describe('scoreReview — evidence weight W = Σ w(c)·a over every appraisal', () => {
  it('sums the outcome and every mechanism, neutral appraisals included', () => {
    const result = scoreReview(
      review({ evidence: [A('supports', 'moderate', 0.5), A('neutral', 'low', 1)] }, [
        { id: 'a', evidence: [A('against', 'very-low', 1), A('neutral', 'high', 0.25)] },
        { id: 'b', evidence: [A('supports', 'high', 0.8)] },
      ]),
    );
    const expected = 0.6 * 0.5 + 0.3 * 1 + 0.1 * 1 + 1 * 0.25 + 1 * 0.8;
    expect(result.evidenceWeight).toBeCloseTo(expected, 14);
    const step = result.steps.find((s) => s.kind === 'evidence-weight')!;
    expect(step.values.outcome).toBeCloseTo(0.6, 14);
    expect(step.values.mechanisms).toBeCloseTo(0.1 + 0.25 + 0.8, 14);
  });

  it('counts an appraisal given twice twice', () => {
    const once = scoreReview(review({ evidence: [A('supports', 'low', 0.5)] }));
    const twice = scoreReview(review({ evidence: [A('supports', 'low', 0.5), A('supports', 'low', 0.5)] }));
    expect(twice.evidenceWeight).toBeCloseTo(2 * once.evidenceWeight, 14);
  });

  it('lets mechanism appraisals alone lift W to 1', () => {
    const result = scoreReview(review({ evidence: [] }, [{ id: 'a', evidence: [A('neutral', 'high', 1)] }]));
    expect(result.evidenceWeight).toBe(1);
    expect(result.verdict).toBe('uncertain'); // P_outcome = prior 0.5
  });
});

describe('scoreReview — protocol, outcome and mechanisms', () => {
  it('applies the protocol dose to mechanisms but no dose penalty to the outcome', () => {
    const result = scoreReview(
      review(
        { evidence: [A('supports')] },
        [{ id: 'tendon', stated: true, minIntensity: 0.8, minEffort: 'hard', evidence: [A('supports')] }],
        { intensity: 0.2, effort: 'easy' },
      ),
    );
    expect(result.outcome.probability).toBeCloseTo(0.8, 14);
    const penalty = LN20 * (0.6 / 0.8 + 2 / 3);
    expect(result.mechanisms[0].dosePenalty).toBeCloseTo(penalty, 14);
    expect(result.mechanisms[0].logOdds).toBeCloseTo(LN4 - penalty, 14);
    expect(result.verdict).toBe('other-reasons');
  });

  it('uses the outcome prior', () => {
    const result = scoreReview(review({ prior: 0.2, evidence: [A('supports')] }));
    expect(result.outcome.probability).toBeCloseTo(0.5, 14);
    expect(result.outcome.term).toBe('about as likely as not');
  });
});

describe('scoreReview — ranking and shares', () => {
  it('ranks by expected contribution, highest first, with shares of the sum', () => {
    const result = scoreReview(
      review({ evidence: [] }, [
        { id: 'small', prior: 0.9, magnitude: 'small', evidence: [] }, // 0.18
        { id: 'large', prior: 0.5, magnitude: 'large', evidence: [] }, // 0.4
        { id: 'none', prior: 0.99, magnitude: 'none', evidence: [] }, // 0
        { id: 'default', prior: 0.6, evidence: [] }, // moderate: 0.3
      ]),
    );
    expect(result.mechanisms.map((m) => m.id)).toEqual(['large', 'default', 'small', 'none']);
    expect(result.mechanisms.map((m) => m.rank)).toEqual([1, 2, 3, 4]);
    const total = 0.18 + 0.4 + 0 + 0.3;
    expect(result.mechanisms.map((m) => m.share)).toEqual(
      [0.4 / total, 0.3 / total, 0.18 / total, 0].map((x) => expect.closeTo(x, 12)),
    );
    expect(result.mechanisms.reduce((s, m) => s + m.share, 0)).toBeCloseTo(1, 12);
  });

  it('breaks a tie in contribution by probability, highest first', () => {
    const result = scoreReview(
      review({ evidence: [] }, [
        { id: 'likely-small', prior: 0.2, magnitude: 'large', evidence: [] }, // 0.2 × 0.8
        { id: 'unlikely-large', prior: 0.8, magnitude: 'small', evidence: [] }, // 0.8 × 0.2
      ]),
    );
    expect(result.mechanisms[0].expectedContribution).toBe(result.mechanisms[1].expectedContribution);
    expect(result.mechanisms.map((m) => m.id)).toEqual(['unlikely-large', 'likely-small']);
  });

  it('breaks a full tie by input order', () => {
    const result = scoreReview(
      review({ evidence: [] }, [
        { id: 'first', evidence: [] },
        { id: 'second', evidence: [] },
        { id: 'third', evidence: [] },
      ]),
    );
    expect(result.mechanisms.map((m) => m.id)).toEqual(['first', 'second', 'third']);
  });

  it('gives every share 0 when all contributions are 0, still ranked by probability', () => {
    const result = scoreReview(
      review({ evidence: [] }, [
        { id: 'low', prior: 0.2, magnitude: 'none', evidence: [] },
        { id: 'high', prior: 0.7, magnitude: 'none', evidence: [] },
      ]),
    );
    expect(result.mechanisms.map((m) => [m.id, m.share])).toEqual([
      ['high', 0],
      ['low', 0],
    ]);
  });
});

describe('scoreReview — working a reviewer can follow', () => {
  const result = scoreReview(
    review({ evidence: [A('supports'), A('supports', 'moderate', 0.5)] }, [
      { id: 'neural-drive', stated: true, evidence: [A('supports', 'high', 0.9)], magnitude: 'large' },
      { id: 'placebo', evidence: [A('neutral')], magnitude: 'small' },
    ]),
  );

  it('lists outcome, evidence weight, verdict and one contribution line per mechanism in rank order', () => {
    expect(result.steps.map((s) => s.kind)).toEqual([
      'outcome',
      'evidence-weight',
      'verdict',
      'contribution',
      'contribution',
    ]);
    expect(result.steps[3].text.startsWith('#1 "neural-drive" (stated)')).toBe(true);
    expect(result.steps[4].text.startsWith('#2 "placebo"')).toBe(true);
  });

  it('states the numbers the verdict rests on, and the label', () => {
    const verdictStep = result.steps.find((s) => s.kind === 'verdict')!;
    expect(verdictStep.text).toContain('Holds up');
    expect(verdictStep.text).toContain('"neural-drive" has p = ');
    expect(verdictStep.values.evidenceWeight).toBe(result.evidenceWeight);
    expect(verdictStep.values.outcomeProbability).toBe(result.outcome.probability);
  });

  it('lets the outcome probability be recomputed from its own steps', () => {
    const prior = result.outcome.steps.find((s) => s.kind === 'prior')!.values.logOdds;
    const evidence = result.outcome.steps
      .filter((s) => s.kind === 'evidence')
      .reduce((sum, s) => sum + s.values.term, 0);
    expect(evidence).toBeCloseTo((1 + 0.6 * 0.5) * LN4, 14);
    expect(result.outcome.probability).toBeCloseTo(1 / (1 + Math.exp(-(prior + evidence))), 14);
  });

  it('lets every mechanism be recomputed from its own steps', () => {
    for (const m of result.mechanisms) {
      const prior = m.steps.find((s) => s.kind === 'prior')!.values.logOdds;
      const evidence = m.steps.filter((s) => s.kind === 'evidence').reduce((sum, s) => sum + s.values.term, 0);
      const penalty = m.steps.find((s) => s.kind === 'dose')!.values.dosePenalty;
      expect(m.probability).toBeCloseTo(1 / (1 + Math.exp(-(prior + evidence - penalty))), 14);
      const contribution = m.steps.find((s) => s.kind === 'contribution')!;
      expect(contribution.values.expectedContribution).toBe(m.expectedContribution);
    }
  });
});

describe('scoreReview — bad input', () => {
  const ok = review({ evidence: [] });
  it.each([
    [{ ...ok, protocol: undefined }, 'protocol'],
    [{ ...ok, protocol: { intensity: 2 } }, 'protocol.intensity'],
    [{ ...ok, protocol: { effort: 'max' } }, 'protocol.effort'],
    [{ ...ok, outcome: undefined }, 'outcome'],
    [{ ...ok, outcome: { prior: 1, evidence: [] } }, 'outcome.prior'],
    [
      { ...ok, outcome: { evidence: [{ direction: 'pro', certainty: 'high', applicability: 1 }] } },
      'outcome.evidence[0].direction',
    ],
    [{ ...ok, mechanisms: undefined }, 'mechanisms'],
    [{ ...ok, mechanisms: [{ evidence: [] }] }, 'mechanisms[0].id'],
    [{ ...ok, mechanisms: [{ id: ' ', evidence: [] }] }, 'mechanisms[0].id'],
    [
      {
        ...ok,
        mechanisms: [
          { id: 'a', evidence: [] },
          { id: 'a', evidence: [] },
        ],
      },
      'mechanisms[1].id',
    ],
    [{ ...ok, mechanisms: [{ id: 'a', stated: 'yes', evidence: [] }] }, 'mechanisms[0].stated'],
    [
      {
        ...ok,
        mechanisms: [
          { id: 'a', evidence: [] },
          {
            id: 'b',
            evidence: [A('supports', 'high', 1), { direction: 'supports', certainty: 'strong', applicability: 1 }],
          },
        ],
      },
      'mechanisms[1].evidence[1].certainty',
    ],
    [{ ...ok, mechanisms: [{ id: 'a', evidence: [], minEffort: 'all-out' }] }, 'mechanisms[0].minEffort'],
  ])('rejects %o at %s', (input, field) => {
    expect(() => scoreReview(input as unknown as ReviewInput)).toThrow(
      expect.objectContaining({ name: 'ScoringInputError', field }),
    );
    expect(() => scoreReview(input as unknown as ReviewInput)).toThrow(ScoringInputError);
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { scoreMechanism, type MechanismInput } from '@/lib/scoring/mechanism';
import { scoreReview, type ReviewInput } from '@/lib/scoring/verdict';
import { likelihoodTerm } from '@/lib/scoring/likelihood';
import type { Appraisal } from '@/lib/scoring/types';

// Properties the model must keep whatever the coach enters (docs/scoring.md §3, §5).

const certainty = fc.constantFrom('high', 'moderate', 'low', 'very-low' as const);
const direction = fc.constantFrom('supports', 'against', 'neutral' as const);
const applicability = fc.double({ min: 0, max: 1, noNaN: true });
const appraisal: fc.Arbitrary<Appraisal> = fc.record({ direction, certainty, applicability });
const effort = fc.constantFrom('easy', 'moderate', 'hard', 'to-failure' as const);
const fraction = fc.double({ min: 0, max: 1, noNaN: true });
const prior = fc.double({ min: 0, max: 1, minExcluded: true, maxExcluded: true, noNaN: true });

const mechanismInput: fc.Arbitrary<MechanismInput> = fc.record(
  {
    prior,
    evidence: fc.array(appraisal, { maxLength: 40 }),
    minIntensity: fraction,
    minEffort: effort,
    protocolIntensity: fraction,
    protocolEffort: effort,
    magnitude: fc.constantFrom('none', 'small', 'moderate', 'large' as const),
  },
  { requiredKeys: ['evidence'] },
);

/** The input with one more appraisal inserted at a random place in the evidence list. */
const withExtra = (extra: fc.Arbitrary<Appraisal>) =>
  fc.tuple(mechanismInput, extra, fc.nat()).map(([input, added, at]) => {
    const evidence = [...input.evidence];
    evidence.splice(at % (evidence.length + 1), 0, added);
    return { before: input, after: { ...input, evidence } };
  });

describe('mechanism probability — properties', () => {
  it('a supporting appraisal never lowers the probability', () => {
    fc.assert(
      fc.property(
        withExtra(fc.record({ direction: fc.constant('supports' as const), certainty, applicability })),
        ({ before, after }) => {
          expect(scoreMechanism(after).probability).toBeGreaterThanOrEqual(scoreMechanism(before).probability);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('an opposing appraisal never raises the probability', () => {
    fc.assert(
      fc.property(
        withExtra(fc.record({ direction: fc.constant('against' as const), certainty, applicability })),
        ({ before, after }) => {
          expect(scoreMechanism(after).probability).toBeLessThanOrEqual(scoreMechanism(before).probability);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('a neutral appraisal changes nothing but the evidence weight', () => {
    fc.assert(
      fc.property(
        withExtra(fc.record({ direction: fc.constant('neutral' as const), certainty, applicability })),
        ({ before, after }) => {
          const a = scoreMechanism(before);
          const b = scoreMechanism(after);
          expect(b.probability).toBe(a.probability);
          expect(b.logOdds).toBe(a.logOdds);
          expect(b.expectedContribution).toBe(a.expectedContribution);
          expect(b.evidenceWeight).toBeGreaterThanOrEqual(a.evidenceWeight);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('a dose or effort shortfall never raises the probability', () => {
    fc.assert(
      fc.property(mechanismInput, (input) => {
        const { minIntensity: _i, minEffort: _e, ...free } = input;
        expect(scoreMechanism(input).probability).toBeLessThanOrEqual(scoreMechanism(free).probability);
      }),
    );
  });

  it('keeps probabilities strictly inside (0, 1), with a matching term, even for huge evidence', () => {
    const big = fc.record({
      prior,
      evidence: fc.array(appraisal, { maxLength: 3000 }),
      minIntensity: fraction,
      protocolIntensity: fraction,
    });
    fc.assert(
      fc.property(fc.oneof(mechanismInput, big), (input) => {
        const r = scoreMechanism(input);
        expect(r.probability).toBeGreaterThan(0);
        expect(r.probability).toBeLessThan(1);
        expect(r.term).toBe(likelihoodTerm(r.probability));
        expect(r.expectedContribution).toBeGreaterThanOrEqual(0);
        expect(r.expectedContribution).toBeLessThan(1);
      }),
      { numRuns: 200 },
    );
  });

  it('does not depend on the order of the appraisals beyond rounding', () => {
    fc.assert(
      fc.property(mechanismInput, fc.nat(), (input, seed) => {
        const shuffled = [...input.evidence].sort(
          (x, y) => ((x.applicability * 1e6 + seed) % 7) - ((y.applicability * 1e6 + seed) % 7),
        );
        expect(scoreMechanism({ ...input, evidence: shuffled }).probability).toBeCloseTo(
          scoreMechanism(input).probability,
          12,
        );
      }),
    );
  });
});

describe('review verdict — properties', () => {
  const reviewInput: fc.Arbitrary<ReviewInput> = fc.record({
    protocol: fc.record({ intensity: fraction, effort }, { requiredKeys: [] }),
    outcome: fc.record({ prior, evidence: fc.array(appraisal, { maxLength: 8 }) }, { requiredKeys: ['evidence'] }),
    mechanisms: fc
      .array(
        fc.record(
          {
            stated: fc.boolean(),
            prior,
            evidence: fc.array(appraisal, { maxLength: 6 }),
            minIntensity: fraction,
            minEffort: effort,
            magnitude: fc.constantFrom('none', 'small', 'moderate', 'large' as const),
          },
          { requiredKeys: ['evidence'] },
        ),
        { maxLength: 6 },
      )
      .map((list) => list.map((m, i) => ({ ...m, id: `m${i}` }))),
  });

  it('follows the verdict table from its own numbers', () => {
    fc.assert(
      fc.property(reviewInput, (input) => {
        const r = scoreReview(input);
        const statedHolds = r.mechanisms.some((m) => m.stated && m.probability >= 0.66);
        const expected =
          r.evidenceWeight < 1
            ? 'insufficient'
            : r.outcome.probability < 0.33
              ? 'not-supported'
              : r.outcome.probability < 0.66
                ? 'uncertain'
                : statedHolds
                  ? 'supported'
                  : 'other-reasons';
        expect(r.verdict).toBe(expected);
      }),
      { numRuns: 300 },
    );
  });

  it('ranks mechanisms by contribution then probability, and shares sum to 1 (or are all 0)', () => {
    fc.assert(
      fc.property(reviewInput, (input) => {
        const r = scoreReview(input);
        for (let i = 1; i < r.mechanisms.length; i += 1) {
          const a = r.mechanisms[i - 1];
          const b = r.mechanisms[i];
          expect(a.expectedContribution).toBeGreaterThanOrEqual(b.expectedContribution);
          if (a.expectedContribution === b.expectedContribution)
            expect(a.probability).toBeGreaterThanOrEqual(b.probability);
        }
        const total = r.mechanisms.reduce((s, m) => s + m.share, 0);
        if (r.mechanisms.some((m) => m.expectedContribution > 0)) expect(total).toBeCloseTo(1, 12);
        else expect(total).toBe(0);
        expect(new Set(r.mechanisms.map((m) => m.id)).size).toBe(input.mechanisms.length);
      }),
      { numRuns: 300 },
    );
  });

  it('keeps every probability in (0, 1)', () => {
    fc.assert(
      fc.property(reviewInput, (input) => {
        const r = scoreReview(input);
        for (const p of [r.outcome.probability, ...r.mechanisms.map((m) => m.probability)]) {
          expect(p).toBeGreaterThan(0);
          expect(p).toBeLessThan(1);
        }
      }),
    );
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { robustness, withoutStudies, type RobustnessResult } from '@/lib/scoring/robustness';
import { scoreReview, type ReviewInput } from '@/lib/scoring/verdict';
import { CERTAINTY_LEVELS } from '@/lib/scoring/constants';
import type { Appraisal } from '@/lib/scoring/types';

// Properties of the robustness report, docs/scoring.md §9 (our model): they must hold for any
// review a coach can enter, and every verdict in the report must be the one scoreReview gives.

const direction = fc.constantFrom('supports', 'against', 'neutral' as const);
const certainty = fc.constantFrom(...CERTAINTY_LEVELS);
const prior = fc.option(fc.double({ min: 0, max: 1, minExcluded: true, maxExcluded: true, noNaN: true }), {
  nil: undefined,
});
/** Few study ids, so studies recur across lists; sometimes none, so position keys are used too. */
const studyId = fc.option(fc.constantFrom('s1', 's2', 's3', 's4', 's5', 's6'), { nil: undefined });
const appraisal = (applicability: fc.Arbitrary<number>): fc.Arbitrary<Appraisal> =>
  fc
    .record({ direction, certainty, applicability, studyId })
    .map(({ studyId: id, ...a }) => (id === undefined ? a : { ...a, studyId: id }));

const reviewOf = (applicability: fc.Arbitrary<number>): fc.Arbitrary<ReviewInput> =>
  fc.record({
    protocol: fc.record(
      { intensity: fc.double({ min: 0, max: 1, noNaN: true }), effort: fc.constantFrom('easy', 'hard' as const) },
      { requiredKeys: [] },
    ),
    outcome: fc.record({ prior, evidence: fc.array(appraisal(applicability), { maxLength: 8 }) }),
    mechanisms: fc
      .array(
        fc.record({
          stated: fc.boolean(),
          prior,
          minIntensity: fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { nil: undefined }),
          evidence: fc.array(appraisal(applicability), { maxLength: 5 }),
        }),
        { maxLength: 3 },
      )
      .map((ms) => ms.map((m, i) => ({ ...m, id: `m${i}` }))),
  });

const review = reviewOf(fc.double({ min: 0, max: 1, noNaN: true }));
const RUNS = { numRuns: 300 };

describe('robustness — properties', () => {
  it('agrees exactly with scoreReview on every re-run', () => {
    fc.assert(
      fc.property(review, (input) => {
        const result = robustness(input);
        expect(result.verdict).toBe(scoreReview(input).verdict);
        for (const row of result.leaveOneOut) {
          const score = scoreReview(withoutStudies(input, [row.studyId]));
          expect(row.verdict).toBe(score.verdict);
          expect(row.outcomeProbability).toBe(score.outcome.probability);
        }
        if (result.fragility === 2) {
          expect(scoreReview(withoutStudies(input, result.fragileSet!)).verdict).not.toBe(result.verdict);
        }
        // One certainty level down and up, redone by hand on a copy of the input.
        const lists = [input.outcome.evidence, ...input.mechanisms.map((m) => m.evidence)];
        const owners = ['outcome', ...input.mechanisms.map((m) => m.id)];
        for (const shift of result.certaintyShifts) {
          const list = lists[owners.indexOf(shift.owner)];
          const level = CERTAINTY_LEVELS.indexOf(list[shift.index].certainty);
          for (const [key, to] of [
            ['down', Math.max(0, level - 1)],
            ['up', Math.min(CERTAINTY_LEVELS.length - 1, level + 1)],
          ] as const) {
            const changed = (owner: string, evidence: readonly Appraisal[]) =>
              owner === shift.owner
                ? evidence.map((a, i) => (i === shift.index ? { ...a, certainty: CERTAINTY_LEVELS[to] } : a))
                : evidence;
            const shifted: ReviewInput = {
              ...input,
              outcome: { ...input.outcome, evidence: changed('outcome', input.outcome.evidence) },
              mechanisms: input.mechanisms.map((m) => ({ ...m, evidence: changed(m.id, m.evidence) })),
            };
            expect(shift[key]).toBe(scoreReview(shifted).verdict);
          }
        }
      }),
      RUNS,
    );
  });

  it('changes nothing when a study no appraisal cites is removed', () => {
    fc.assert(
      fc.property(review, (input) => {
        const smaller = withoutStudies(input, ['not-cited', 'outcome#99']);
        expect(scoreReview(smaller)).toEqual(scoreReview(input));
        expect(robustness(smaller)).toEqual(robustness(input));
      }),
      RUNS,
    );
  });

  it('always contains the review’s own priors in the prior ranges, and keeps the verdict inside them', () => {
    const clamp = (p: number | undefined) => Math.min(0.99, Math.max(0.01, p ?? 0.5));
    fc.assert(
      fc.property(review, fc.double({ min: 0.01, max: 0.99, noNaN: true }), (input, u) => {
        const result = robustness(input);
        const own = clamp(input.outcome.prior);
        expect(result.outcomePriorRange.low).toBeLessThanOrEqual(own);
        expect(result.outcomePriorRange.high).toBeGreaterThanOrEqual(own);
        input.mechanisms.forEach((m, i) => {
          expect(result.mechanismPriorRanges[i].id).toBe(m.id);
          expect(result.mechanismPriorRanges[i].low).toBeLessThanOrEqual(clamp(m.prior));
          expect(result.mechanismPriorRanges[i].high).toBeGreaterThanOrEqual(clamp(m.prior));
        });
        // Any prior strictly inside the outcome range gives the same verdict.
        const { low, high } = result.outcomePriorRange;
        const inside = low + u * (high - low);
        if (inside > low && inside < high) {
          const moved = { ...input, outcome: { ...input.outcome, prior: inside } };
          expect(scoreReview(moved).verdict).toBe(result.verdict);
        }
      }),
      RUNS,
    );
  });

  it('has at least one pivotal study when the fragility is 1, and none when it is 2 or null', () => {
    fc.assert(
      fc.property(review, (input) => {
        const result = robustness(input);
        if (result.fragility === 1) {
          expect(result.pivotal.length).toBeGreaterThan(0);
          expect(result.pivotal).toContain(result.fragileSet![0]);
        } else {
          expect(result.pivotal).toEqual([]);
        }
      }),
      RUNS,
    );
  });

  it('does not depend on the order of studies with equal content', () => {
    // Applicability in quarters: sums of quarters are exact in binary floating point, so the same
    // studies in another order give the same sums to the last bit (any other value could differ in
    // the last bit, which is rounding, not the model).
    const quarters = fc.constantFrom(0, 0.25, 0.5, 0.75, 1);
    /** A study: its appraisals, each on the outcome (−1) or a mechanism 0…2. */
    const study = fc.array(fc.record({ on: fc.integer({ min: -1, max: 2 }), a: appraisal(quarters) }), {
      minLength: 1,
      maxLength: 4,
    });
    const build = (studies: { on: number; a: Appraisal }[][], ids: string[], stated: boolean[]): ReviewInput => {
      const lists: Appraisal[][] = [[], [], [], []];
      studies.forEach((s, i) => s.forEach(({ on, a }) => lists[on + 1].push({ ...a, studyId: ids[i] })));
      return {
        protocol: {},
        outcome: { evidence: lists[0] },
        mechanisms: stated.map((st, i) => ({ id: `m${i}`, stated: st, evidence: lists[i + 1] })),
      };
    };
    const summary = (r: RobustnessResult) => ({
      verdict: r.verdict,
      fragility: r.fragility,
      outcomePriorRange: r.outcomePriorRange,
      mechanismPriorRanges: r.mechanismPriorRanges,
      leaveOneOut: [...r.leaveOneOut].sort((x, y) => x.studyId.localeCompare(y.studyId)),
      pivotal: [...r.pivotal].sort(),
      shifts: r.certaintyShifts.map((s) => `${s.owner} ${s.down} ${s.up}`).sort(),
    });
    fc.assert(
      fc.property(
        fc.array(study, { minLength: 1, maxLength: 6 }),
        fc.array(fc.boolean(), { minLength: 3, maxLength: 3 }),
        fc.nat(),
        (studies, stated, seed) => {
          const ids = studies.map((_, i) => `study-${i}`);
          // Another order of the same studies (a rotation and a reversal by the seed).
          const order = studies.map((_, i) => i);
          const r = seed % order.length;
          const moved = [...order.slice(r), ...order.slice(0, r)];
          if (seed % 2 === 1) moved.reverse();
          const a = robustness(build(studies, ids, stated));
          const b = robustness(
            build(
              moved.map((i) => studies[i]),
              moved.map((i) => ids[i]),
              stated,
            ),
          );
          expect(summary(b)).toEqual(summary(a));
        },
      ),
      RUNS,
    );
  });
});

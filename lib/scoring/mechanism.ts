import {
  CERTAINTY_WEIGHT,
  DEFAULT_MAGNITUDE,
  DEFAULT_PRIOR,
  DIRECTION_SIGN,
  DOSE_PENALTY_ODDS,
  EFFORT_SCALE,
  EFFORT_SPAN,
  LIKELIHOOD_RATIO_PER_APPRAISAL,
  MAGNITUDE_VALUE,
  PRIOR_CLAMP,
  PROBABILITY_GUARD,
} from './constants';
import { ScoringInputError } from './errors';
import { formatNumber, formatSigned } from './format';
import { likelihoodTerm } from './likelihood';
import { requireArray, requireFinite, requireFraction, requireKey, requireObject } from './validate';
import type { Appraisal, CertaintyLevel, Direction, Effort, LikelihoodTerm, Magnitude, WorkingStep } from './types';

const LN_LR = Math.log(LIKELIHOOD_RATIO_PER_APPRAISAL);
const LN_DOSE = Math.log(DOSE_PENALTY_ODDS);

/**
 * Everything the model needs to score one mechanism (docs/scoring.md §3).
 *
 * @example
 * const input: MechanismInput = {
 *   prior: 0.4,
 *   evidence: [{ direction: 'supports', certainty: 'moderate', applicability: 0.75 }],
 *   minIntensity: 0.7, minEffort: 'hard',
 *   protocolIntensity: 0.3, protocolEffort: 'easy',
 *   magnitude: 'large',
 * };
 */
export interface MechanismInput {
  /** Plausibility before evidence, inside (0, 1); default 0.5, clamped to [0.01, 0.99]. */
  prior?: number;
  evidence: readonly Appraisal[];
  /** The least intensity (fraction of maximum) the mechanism needs, if it needs one. */
  minIntensity?: number;
  /** The least effort the mechanism needs, if it needs one. */
  minEffort?: Effort;
  protocolIntensity?: number;
  protocolEffort?: Effort;
  /** How big the effect would be if the mechanism works; default 'moderate'. */
  magnitude?: Magnitude;
}

/**
 * A scored mechanism with its working.
 *
 * @example
 * const score: MechanismScore = scoreMechanism({ evidence: [] });
 * score.probability; // 0.5
 */
export interface MechanismScore {
  probability: number;
  term: LikelihoodTerm;
  logOdds: number;
  dosePenalty: number;
  expectedContribution: number;
  steps: WorkingStep[];
  /** The prior after clamping. */
  prior: number;
  /** Σ s·w(c)·a·ln 4 over the appraisals. */
  evidenceLogOdds: number;
  /** Σ w(c)·a over the appraisals, neutral ones included (this mechanism's part of W). */
  evidenceWeight: number;
  magnitude: Magnitude;
  shortfall: { intensity: number; effort: number };
}

/**
 * Log-odds of a probability.
 *
 * @example
 * logit(0.8); // 1.3863 (= ln 4)
 */
export function logit(p: number): number {
  requireFinite('probability', p, { min: 0, max: 1, minExclusive: true, maxExclusive: true });
  return Math.log(p / (1 - p));
}

/**
 * Probability from log-odds, held strictly inside (0, 1): a review with thousands of agreeing
 * appraisals would otherwise round to exactly 1, which the model never claims.
 *
 * @example
 * logistic(Math.log(4)); // 0.8
 * logistic(5000) < 1; // true
 */
export function logistic(logOdds: number): number {
  if (Number.isNaN(logOdds)) throw new ScoringInputError('logOdds', 'must be a number, got NaN');
  const p = logOdds >= 0 ? 1 / (1 + Math.exp(-logOdds)) : Math.exp(logOdds) / (1 + Math.exp(logOdds));
  return Math.min(1 - PROBABILITY_GUARD, Math.max(PROBABILITY_GUARD, p));
}

/**
 * One appraisal's term in the log-odds sum, s · w(c) · a · ln 4, for showing appraisal by
 * appraisal in the workbench.
 *
 * @example
 * appraisalLogOdds({ direction: 'supports', certainty: 'high', applicability: 1 }); // 1.3863
 * appraisalLogOdds({ direction: 'against', certainty: 'low', applicability: 0.5 }); // −0.2079
 */
export function appraisalLogOdds(appraisal: Appraisal): number {
  const raw = requireObject('appraisal', appraisal);
  const direction = requireKey('direction', raw.direction, DIRECTION_SIGN);
  const certainty = requireKey('certainty', raw.certainty, CERTAINTY_WEIGHT);
  const applicability = requireFraction('applicability', raw.applicability);
  return DIRECTION_SIGN[direction] * CERTAINTY_WEIGHT[certainty] * applicability * LN_LR;
}

const DIRECTIONS: readonly Direction[] = ['supports', 'against', 'neutral'];
const CERTAINTIES: readonly CertaintyLevel[] = ['high', 'moderate', 'low', 'very-low'];
// Switches rather than lookup objects: they are faster in the hot loop, and a key such as
// 'constructor' cannot slip through as an inherited property.
const directionIndex = (value: unknown): number => {
  switch (value) {
    case 'supports':
      return 0;
    case 'against':
      return 1;
    case 'neutral':
      return 2;
    default:
      return -1;
  }
};
const certaintyIndex = (value: unknown): number => {
  switch (value) {
    case 'high':
      return 0;
    case 'moderate':
      return 1;
    case 'low':
      return 2;
    case 'very-low':
      return 3;
    default:
      return -1;
  }
};
const DIRECTION_ADJECTIVE: Record<Direction, string> = {
  supports: 'supporting',
  against: 'opposing',
  neutral: 'neutral',
};
const CERTAINTY_WORDS: Record<CertaintyLevel, string> = {
  high: 'high',
  moderate: 'moderate',
  low: 'low',
  'very-low': 'very low',
};

/**
 * Prior and evidence of one score, summed by direction × certainty, with their working.
 *
 * @internal Exported for verdict.ts only.
 * @example
 * const tally: EvidenceTally = tallyEvidence('outcome', 0.5, []);
 * tally.evidenceWeight; // 0
 */
export interface EvidenceTally {
  prior: number;
  priorLogOdds: number;
  evidenceLogOdds: number;
  evidenceWeight: number;
  count: number;
  steps: WorkingStep[];
}

const plural = (n: number, word: string): string => `${n} ${word}${n === 1 ? '' : 's'}`;
const plusMinus = (x: number): string => (x < 0 ? `− ${formatNumber(-x)}` : `+ ${formatNumber(x)}`);

/**
 * The prior as the model uses it: the default when none is given, else the given value clamped
 * to [0.01, 0.99] (docs/scoring.md §3 and precise rules), with its log-odds.
 *
 * @internal Shared by {@link tallyEvidence} and robustness.ts (which moves the prior).
 * @example
 * readPrior('outcome', 0.995); // { prior: 0.99, priorLogOdds: 4.5951, given: 0.995 }
 */
export function readPrior(
  field: string,
  priorInput: unknown,
): { prior: number; priorLogOdds: number; given: number | undefined } {
  let prior = DEFAULT_PRIOR;
  let given: number | undefined;
  if (priorInput !== undefined) {
    given = requireFinite(`${field}.prior`, priorInput, { min: 0, max: 1, minExclusive: true, maxExclusive: true });
    prior = Math.min(PRIOR_CLAMP.max, Math.max(PRIOR_CLAMP.min, given));
  }
  return { prior, priorLogOdds: Math.log(prior / (1 - prior)), given };
}

/**
 * Number of direction × certainty slots an evidence list is tallied into.
 *
 * @internal
 * @example
 * new Float64Array(TALLY_SLOTS); // one sum of applicability per slot
 */
export const TALLY_SLOTS = 12;

/**
 * The slot of an already validated appraisal: direction index × 4 + certainty index.
 *
 * @internal Used by robustness.ts, which tallies the same lists with studies left out.
 * @example
 * tallySlot({ direction: 'against', certainty: 'low', applicability: 1 }); // 6
 */
export function tallySlot(appraisal: Appraisal): number {
  return directionIndex(appraisal.direction) * 4 + certaintyIndex(appraisal.certainty);
}

/**
 * Σ s·w(c)·a·ln 4 and Σ w(c)·a from per-slot counts and applicability sums, slot by slot in a
 * fixed order, so any caller that tallies the same appraisals gets bit-for-bit the same numbers
 * (robustness.ts relies on this to agree with {@link scoreReview} exactly).
 *
 * @internal Shared by {@link tallyEvidence} and robustness.ts.
 * @example
 * const counts = new Uint32Array(TALLY_SLOTS); const sums = new Float64Array(TALLY_SLOTS);
 * counts[0] = 1; sums[0] = 1; // one supporting, high-certainty, fully applicable appraisal
 * sumTally(counts, sums); // { evidenceLogOdds: 1.3863, evidenceWeight: 1 }
 */
export function sumTally(
  counts: ArrayLike<number>,
  sums: ArrayLike<number>,
  onSlot?: (direction: number, certainty: number, count: number, applicabilitySum: number, term: number) => void,
): { evidenceLogOdds: number; evidenceWeight: number } {
  let evidenceLogOdds = 0;
  let evidenceWeight = 0;
  for (let d = 0; d < 3; d += 1) {
    for (let c = 0; c < 4; c += 1) {
      const slot = d * 4 + c;
      const n = counts[slot];
      if (n === 0) continue;
      const weight = CERTAINTY_WEIGHT[CERTAINTIES[c]];
      const sumA = sums[slot];
      evidenceWeight += weight * sumA;
      const sign = DIRECTION_SIGN[DIRECTIONS[d]];
      const term = sign === 0 ? 0 : sign * weight * sumA * LN_LR;
      if (sign !== 0) evidenceLogOdds += term;
      onSlot?.(d, c, n, sumA, term);
    }
  }
  return { evidenceLogOdds, evidenceWeight };
}

/**
 * Prior and evidence part of the log-odds, grouped by direction × certainty so that a review of
 * thousands of appraisals still reads as at most nine lines, each redoable by hand from the
 * appraisal list (count, sum of applicability, weight, ln 4).
 *
 * @internal Shared by {@link scoreMechanism} and the outcome score in verdict.ts.
 * @example
 * tallyEvidence('outcome', undefined, []).priorLogOdds; // 0
 */
export function tallyEvidence(field: string, priorInput: unknown, evidenceInput: unknown): EvidenceTally {
  const { prior, priorLogOdds, given } = readPrior(field, priorInput);
  const priorText =
    given === undefined
      ? `Prior plausibility ${formatNumber(DEFAULT_PRIOR)} (none given, the default)`
      : prior === given
        ? `Prior plausibility ${formatNumber(prior)}`
        : `Prior plausibility ${formatNumber(given)}, held at ${formatNumber(prior)} (priors stay within ` +
          `${formatNumber(PRIOR_CLAMP.min)}…${formatNumber(PRIOR_CLAMP.max)} so evidence can always move them)`;
  const steps: WorkingStep[] = [
    {
      kind: 'prior',
      text: `${priorText} → log-odds ln(${formatNumber(prior)} / ${formatNumber(1 - prior)}) = ${formatNumber(priorLogOdds)}.`,
      values: { prior, logOdds: priorLogOdds },
    },
  ];

  const evidence = requireArray<unknown>(`${field}.evidence`, evidenceInput);
  const counts = new Uint32Array(TALLY_SLOTS);
  const sums = new Float64Array(TALLY_SLOTS);
  for (let i = 0; i < evidence.length; i += 1) {
    const item = evidence[i] as Partial<Record<keyof Appraisal, unknown>> | null;
    if (typeof item !== 'object' || item === null) {
      requireObject(`${field}.evidence[${i}]`, item);
    }
    const a = item as Partial<Record<keyof Appraisal, unknown>>;
    const d = directionIndex(a.direction);
    if (d < 0) requireKey(`${field}.evidence[${i}].direction`, a.direction, DIRECTION_SIGN);
    const c = certaintyIndex(a.certainty);
    if (c < 0) requireKey(`${field}.evidence[${i}].certainty`, a.certainty, CERTAINTY_WEIGHT);
    const applicability = a.applicability;
    if (
      typeof applicability !== 'number' ||
      !(applicability >= 0 && applicability <= 1) // also rejects NaN
    ) {
      requireFraction(`${field}.evidence[${i}].applicability`, applicability);
    }
    const slot = d * 4 + c;
    counts[slot] += 1;
    sums[slot] += applicability as number;
  }

  let neutralCount = 0;
  let neutralWeight = 0;
  const { evidenceLogOdds, evidenceWeight } = sumTally(counts, sums, (d, c, n, sumA, term) => {
    const direction = DIRECTIONS[d];
    const certainty = CERTAINTIES[c];
    const weight = CERTAINTY_WEIGHT[certainty];
    if (direction === 'neutral') {
      neutralCount += n;
      neutralWeight += weight * sumA;
      return;
    }
    const sign = DIRECTION_SIGN[direction];
    steps.push({
      kind: 'evidence',
      text:
        `${plural(n, `${DIRECTION_ADJECTIVE[direction]} appraisal`)} of ${CERTAINTY_WORDS[certainty]} certainty: ` +
        `${formatSigned(sign, 0)} × weight ${formatNumber(weight)} × applicability ${formatNumber(sumA)}` +
        `${n > 1 ? ' (summed)' : ''} × ln ${LIKELIHOOD_RATIO_PER_APPRAISAL} (${formatNumber(LN_LR)}) = ${formatSigned(term)}.`,
      values: { count: n, sign, weight, applicabilitySum: sumA, term },
    });
  });
  if (neutralCount > 0) {
    steps.push({
      kind: 'evidence',
      text:
        `${plural(neutralCount, 'neutral appraisal')}: direction 0, so ${neutralCount === 1 ? 'it adds' : 'they add'} ` +
        `nothing to the log-odds (${neutralCount === 1 ? 'it counts' : 'they count'} ${formatNumber(neutralWeight)} toward the evidence weight).`,
      values: { count: neutralCount, sign: 0, weight: neutralWeight, term: 0 },
    });
  }
  if (evidence.length === 0) {
    steps.push({
      kind: 'evidence',
      text: 'No appraisals yet: the evidence adds nothing to the prior.',
      values: { count: 0, term: 0 },
    });
  }
  return { prior, priorLogOdds, evidenceLogOdds, evidenceWeight, count: evidence.length, steps };
}

/**
 * The probability after a change of log-odds from the prior, the number
 * {@link finishProbability} reports.
 *
 * @internal Shared by {@link finishProbability} and robustness.ts.
 * @example
 * moveFromPrior(0.5, 0, Math.log(4)).probability; // 0.8
 */
export function moveFromPrior(
  prior: number,
  priorLogOdds: number,
  change: number,
): { probability: number; logOdds: number; guarded: boolean } {
  const logOdds = priorLogOdds + change;
  const unguarded = logOdds >= 0 ? 1 / (1 + Math.exp(-logOdds)) : Math.exp(logOdds) / (1 + Math.exp(logOdds));
  const fromLogOdds = logistic(logOdds);
  // ln and exp do not round-trip exactly, so measure the move from the prior itself: nothing
  // added leaves the prior as given (a prior on a band edge such as 0.66 stays on it), and a net
  // push up (down) can never land a rounding error below (above) where it started.
  const probability = change === 0 ? prior : change > 0 ? Math.max(prior, fromLogOdds) : Math.min(prior, fromLogOdds);
  return { probability, logOdds, guarded: fromLogOdds !== unguarded };
}

/**
 * Turns prior log-odds, evidence and penalty into the probability and its closing step.
 *
 * @internal Shared with verdict.ts.
 * @example
 * finishProbability(0.5, 0, 0, 0, []).probability; // 0.5
 */
export function finishProbability(
  prior: number,
  priorLogOdds: number,
  evidenceLogOdds: number,
  dosePenalty: number,
  steps: WorkingStep[],
): { probability: number; term: LikelihoodTerm; logOdds: number } {
  const { probability, logOdds, guarded } = moveFromPrior(prior, priorLogOdds, evidenceLogOdds - dosePenalty);
  const term = likelihoodTerm(probability);
  steps.push({
    kind: 'probability',
    text:
      `Log-odds ${formatNumber(priorLogOdds)} ${plusMinus(evidenceLogOdds)}` +
      `${dosePenalty !== 0 ? ` − ${formatNumber(dosePenalty)}` : ''} = ${formatNumber(logOdds)} → probability ` +
      `1 / (1 + e^(${formatNumber(-logOdds)})) = ${formatNumber(probability)}` +
      `${guarded ? ' (held a hair inside 0…1: the odds are beyond what a double can show)' : ''}: ${term}.`,
    values: { priorLogOdds, evidenceLogOdds, dosePenalty, logOdds, probability },
  });
  return { probability, term, logOdds };
}

/**
 * Probability that a mechanism operates under this protocol, by log-odds updating (docs/scoring.md §3):
 *
 *     logit(p) = logit(prior) + Σ s_i · w(c_i) · a_i · ln 4 − ln 20 · (shortfall_I + shortfall_E)
 *
 * and its expected contribution p × magnitude. A shortfall counts only when the mechanism states
 * a minimum and the protocol value is known; a minimum intensity of 0 asks for nothing.
 *
 * @example
 * scoreMechanism({
 *   evidence: [{ direction: 'supports', certainty: 'high', applicability: 1 }],
 * }).probability; // 0.8 (odds 1 × 4)
 *
 * scoreMechanism({
 *   evidence: [],
 *   minIntensity: 0.8, protocolIntensity: 0.4, // half the needed intensity
 * }).dosePenalty; // ln 20 × 0.5 = 1.4979
 */
export function scoreMechanism(input: MechanismInput): MechanismScore {
  return scoreMechanismAt('mechanism', input);
}

/**
 * {@link scoreMechanism} with the field path used in error messages, so that a review's bad
 * appraisal is reported as `mechanisms[2].evidence[5].certainty`.
 *
 * @internal Used by verdict.ts.
 * @example
 * scoreMechanismAt('mechanisms[0]', { evidence: [] }).probability; // 0.5
 */
export function scoreMechanismAt(field: string, input: MechanismInput): MechanismScore {
  const raw = requireObject(field, input);
  const tally = tallyEvidence(field, raw.prior, raw.evidence);
  const steps = tally.steps;

  const minIntensity =
    raw.minIntensity === undefined ? undefined : requireFraction(`${field}.minIntensity`, raw.minIntensity);
  const protocolIntensity =
    raw.protocolIntensity === undefined
      ? undefined
      : requireFraction(`${field}.protocolIntensity`, raw.protocolIntensity);
  const minEffort =
    raw.minEffort === undefined ? undefined : requireKey(`${field}.minEffort`, raw.minEffort, EFFORT_SCALE);
  const protocolEffort =
    raw.protocolEffort === undefined
      ? undefined
      : requireKey(`${field}.protocolEffort`, raw.protocolEffort, EFFORT_SCALE);
  const magnitude: Magnitude =
    raw.magnitude === undefined ? DEFAULT_MAGNITUDE : requireKey(`${field}.magnitude`, raw.magnitude, MAGNITUDE_VALUE);

  const parts: string[] = [];
  let intensityShortfall = 0;
  if (minIntensity === undefined || minIntensity === 0) {
    parts.push('no minimum intensity stated');
  } else if (protocolIntensity === undefined) {
    parts.push(
      `minimum intensity ${formatNumber(minIntensity)}, but the protocol's intensity is not recorded: shortfall 0`,
    );
  } else {
    intensityShortfall = Math.max(0, (minIntensity - protocolIntensity) / minIntensity);
    parts.push(
      `intensity shortfall max(0, (${formatNumber(minIntensity)} − ${formatNumber(protocolIntensity)}) / ` +
        `${formatNumber(minIntensity)}) = ${formatNumber(intensityShortfall)}`,
    );
  }
  let effortShortfall = 0;
  if (minEffort === undefined) {
    parts.push('no minimum effort stated');
  } else if (protocolEffort === undefined) {
    parts.push(`minimum effort ${minEffort}, but the protocol's effort is not recorded: shortfall 0`);
  } else {
    const need = EFFORT_SCALE[minEffort];
    const have = EFFORT_SCALE[protocolEffort];
    effortShortfall = Math.max(0, (need - have) / EFFORT_SPAN);
    parts.push(
      `effort shortfall max(0, (${need} ${minEffort} − ${have} ${protocolEffort}) / ${EFFORT_SPAN}) = ` +
        `${formatNumber(effortShortfall)}`,
    );
  }
  const dosePenalty = LN_DOSE * (intensityShortfall + effortShortfall);
  const sentence = parts.join('; ');
  steps.push({
    kind: 'dose',
    text:
      `${sentence.charAt(0).toUpperCase()}${sentence.slice(1)}. Dose penalty ln ${DOSE_PENALTY_ODDS} × ` +
      `(${formatNumber(intensityShortfall)} + ${formatNumber(effortShortfall)}) = ${formatNumber(dosePenalty)}.`,
    values: { intensityShortfall, effortShortfall, dosePenalty },
  });

  const { probability, term, logOdds } = finishProbability(
    tally.prior,
    tally.priorLogOdds,
    tally.evidenceLogOdds,
    dosePenalty,
    steps,
  );
  const magnitudeValue = MAGNITUDE_VALUE[magnitude];
  const expectedContribution = probability * magnitudeValue;
  steps.push({
    kind: 'contribution',
    text:
      `Expected contribution ${formatNumber(probability)} × ${formatNumber(magnitudeValue)} (${magnitude} effect) = ` +
      `${formatNumber(expectedContribution)}.`,
    values: { probability, magnitude: magnitudeValue, expectedContribution },
  });

  return {
    probability,
    term,
    logOdds,
    dosePenalty,
    expectedContribution,
    steps,
    prior: tally.prior,
    evidenceLogOdds: tally.evidenceLogOdds,
    evidenceWeight: tally.evidenceWeight,
    magnitude,
    shortfall: { intensity: intensityShortfall, effort: effortShortfall },
  };
}

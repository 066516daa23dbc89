import { CERTAINTY_LEVELS, PRIOR_CLAMP, VERDICT_THRESHOLDS } from './constants';
import { ScoringInputError } from './errors';
import { LIKELIHOOD_BANDS, likelihoodBand } from './likelihood';
import { logistic, logit, moveFromPrior, readPrior, sumTally, TALLY_SLOTS, tallySlot } from './mechanism';
import { scoreReview, verdictKey, type ReviewInput } from './verdict';
import type { Appraisal, VerdictKey } from './types';

/**
 * What a verdict hangs on (docs/scoring.md §9): which studies it cannot lose, how far the priors
 * may move before it changes, and which certainty calls decide it. Pure and deterministic; every
 * verdict here is the one {@link scoreReview} gives for the changed input, bit for bit, because
 * the re-runs tally with the same functions (mechanism.ts) in the same order.
 *
 * @module
 */

/**
 * The verdict without one study.
 *
 * @example
 * const row: LeaveOneOutRow = { studyId: '17', verdict: 'insufficient', outcomeProbability: 0.7252, changed: true };
 */
export interface LeaveOneOutRow {
  studyId: string;
  verdict: VerdictKey;
  /** P_outcome without that study. */
  outcomeProbability: number;
  /** The verdict key differs from the review's. */
  changed: boolean;
}

/**
 * Priors (0.01…0.99) over which a verdict key or a likelihood term stays the same.
 *
 * @example
 * const range: PriorRange = { low: 0.2425, high: 0.99 };
 */
export interface PriorRange {
  low: number;
  high: number;
}

/**
 * The verdict if one appraisal's certainty were one level lower or higher.
 *
 * @example
 * const shift: CertaintyShift = { owner: 'outcome', index: 0, down: 'insufficient', up: 'supported' };
 */
export interface CertaintyShift {
  /** 'outcome' or the mechanism's id. */
  owner: string;
  /** Position of the appraisal in its owner's evidence list. */
  index: number;
  down: VerdictKey;
  up: VerdictKey;
}

/**
 * The whole robustness report of a review (docs/scoring.md §9).
 *
 * @example
 * const result: RobustnessResult = robustness({ protocol: {}, outcome: { evidence: [] }, mechanisms: [] });
 * result.fragility; // null
 */
export interface RobustnessResult {
  verdict: VerdictKey;
  /** One row per study, in study order. */
  leaveOneOut: LeaveOneOutRow[];
  /** Studies whose removal alone changes the verdict, in study order. */
  pivotal: string[];
  /** The smallest number of studies (up to two) whose removal together changes the verdict. */
  fragility: 1 | 2 | null;
  /** The first such set: singles in study order, then pairs in lexicographic order of positions. */
  fragileSet: string[] | null;
  outcomePriorRange: PriorRange;
  /** In input order. */
  mechanismPriorRanges: ({ id: string } & PriorRange)[];
  /** One row per appraisal: the outcome's first, then each mechanism's in input order. */
  certaintyShifts: CertaintyShift[];
}

/** The key a study is known by: its id, or `<owner>#<position>` for an appraisal without one. */
function studyKey(field: string, owner: string, index: number, appraisal: Appraisal): string {
  const id: unknown = appraisal.studyId;
  if (id === undefined) return `${owner}#${index}`;
  if (typeof id !== 'string' || id === '') {
    throw new ScoringInputError(`${field}.evidence[${index}].studyId`, 'must be a non-empty string when given');
  }
  return id;
}

/** The evidence lists of a review, the outcome's first, with the owner each belongs to. */
function evidenceLists(input: ReviewInput): { owner: string; field: string; evidence: readonly Appraisal[] }[] {
  return [
    { owner: 'outcome', field: 'outcome', evidence: input.outcome.evidence },
    ...input.mechanisms.map((m, i) => ({ owner: m.id, field: `mechanisms[${i}]`, evidence: m.evidence })),
  ];
}

/**
 * The review without some studies: every appraisal of each, from the outcome and every mechanism
 * (docs/scoring.md §9). The appraisals kept carry their study key as `studyId`, so a position-keyed
 * study keeps its key in the smaller review. Useful on its own for a dry run ("the verdict without
 * the retracted study": `scoreReview(withoutStudies(input, ['17']))`).
 *
 * @example
 * const smaller = withoutStudies(input, ['17', 'outcome#2']);
 */
export function withoutStudies(input: ReviewInput, studyIds: readonly string[]): ReviewInput {
  const drop = new Set(studyIds);
  const keep = (field: string, owner: string, evidence: readonly Appraisal[]): Appraisal[] =>
    evidence.flatMap((a, i) => {
      const key = studyKey(field, owner, i, a);
      return drop.has(key) ? [] : [{ ...a, studyId: key }];
    });
  return {
    ...input,
    outcome: { ...input.outcome, evidence: keep('outcome', 'outcome', input.outcome.evidence) },
    mechanisms: input.mechanisms.map((m, i) => ({ ...m, evidence: keep(`mechanisms[${i}]`, m.id, m.evidence) })),
  };
}

const NO_STUDY = -1;
const NO_APPRAISAL = -1;

/**
 * The review flattened once for fast re-runs: each appraisal's list, tally slot, applicability
 * and study, in list order; and each list's prior, dose penalty and stated flag.
 */
interface Flat {
  studies: string[];
  target: Int32Array;
  slot: Int32Array;
  applicability: Float64Array;
  study: Int32Array;
  owners: { owner: string; prior: number; priorLogOdds: number; dosePenalty: number; stated: boolean }[];
}

function flatten(input: ReviewInput, dosePenaltyById: Map<string, number>): Flat {
  const lists = evidenceLists(input);
  const total = lists.reduce((n, l) => n + l.evidence.length, 0);
  const flat: Flat = {
    studies: [],
    target: new Int32Array(total),
    slot: new Int32Array(total),
    applicability: new Float64Array(total),
    study: new Int32Array(total),
    owners: [],
  };
  const position = new Map<string, number>();
  let k = 0;
  lists.forEach((list, t) => {
    const mechanism = t === 0 ? undefined : input.mechanisms[t - 1];
    const { prior, priorLogOdds } = readPrior(list.field, mechanism ? mechanism.prior : input.outcome.prior);
    flat.owners.push({
      owner: list.owner,
      prior,
      priorLogOdds,
      dosePenalty: mechanism ? dosePenaltyById.get(mechanism.id)! : 0,
      stated: mechanism?.stated === true,
    });
    list.evidence.forEach((a, i) => {
      const key = studyKey(list.field, list.owner, i, a);
      let s = position.get(key);
      if (s === undefined) {
        s = flat.studies.length;
        position.set(key, s);
        flat.studies.push(key);
      }
      flat.target[k] = t;
      flat.slot[k] = tallySlot(a);
      flat.applicability[k] = a.applicability;
      flat.study[k] = s;
      k += 1;
    });
  });
  return flat;
}

/** The tally orders certainty high (0) … very-low (3) within a direction (mechanism.ts). */
const LOWEST_CERTAINTY = CERTAINTY_LEVELS.length - 1;

/**
 * Re-scores the flattened review with up to two studies left out and, optionally, one appraisal
 * at another tally slot. Same sums, same order as scoreReview, so the same numbers. Only the
 * lists that the change touches are tallied again; the others keep the whole review's tally.
 */
function makeEvaluator(flat: Flat) {
  const owners = flat.owners.length;
  const counts = new Uint32Array(TALLY_SLOTS);
  const sums = new Float64Array(TALLY_SLOTS);
  // Lists are contiguous in the flat arrays (flattened list by list).
  const from = new Int32Array(owners + 1);
  for (let k = 0; k < flat.target.length; k += 1) from[flat.target[k] + 1] = k + 1;
  for (let t = 1; t <= owners; t += 1) from[t] = Math.max(from[t], from[t - 1]);
  // touched[s * owners + t]: study s has an appraisal in list t.
  const touched = new Uint8Array(flat.studies.length * owners);
  for (let k = 0; k < flat.target.length; k += 1) touched[flat.study[k] * owners + flat.target[k]] = 1;

  const tallyList = (t: number, dropA: number, dropB: number, shifted: number, shiftedSlot: number) => {
    counts.fill(0);
    sums.fill(0);
    for (let k = from[t]; k < from[t + 1]; k += 1) {
      const s = flat.study[k];
      if (s === dropA || s === dropB) continue;
      const at = k === shifted ? shiftedSlot : flat.slot[k];
      counts[at] += 1;
      sums[at] += flat.applicability[k];
    }
    const tally = sumTally(counts, sums);
    const o = flat.owners[t];
    const change = tally.evidenceLogOdds - o.dosePenalty;
    const { probability } = moveFromPrior(o.prior, o.priorLogOdds, change);
    return { probability, weight: tally.evidenceWeight, change };
  };
  const whole = flat.owners.map((_, t) => tallyList(t, NO_STUDY, NO_STUDY, NO_APPRAISAL, 0));

  const evaluate = (dropA: number, dropB: number, shifted: number, shiftedSlot: number) => {
    const shiftedList = shifted === NO_APPRAISAL ? -1 : flat.target[shifted];
    let outcomeProbability = 0;
    let outcomeWeight = 0;
    let mechanismWeight = 0;
    let statedHolds = false;
    for (let t = 0; t < owners; t += 1) {
      const redo =
        t === shiftedList ||
        (dropA !== NO_STUDY && touched[dropA * owners + t] === 1) ||
        (dropB !== NO_STUDY && touched[dropB * owners + t] === 1);
      const list = redo ? tallyList(t, dropA, dropB, shifted, shiftedSlot) : whole[t];
      if (t === 0) {
        outcomeProbability = list.probability;
        outcomeWeight = list.weight;
      } else {
        mechanismWeight += list.weight;
        if (flat.owners[t].stated && list.probability >= VERDICT_THRESHOLDS.holds) statedHolds = true;
      }
    }
    return {
      verdict: verdictKey(outcomeWeight + mechanismWeight, outcomeProbability, statedHolds),
      outcomeProbability,
    };
  };
  return { evaluate, whole };
}

/**
 * The prior at which a target whose evidence moves the log-odds by `change` lands exactly on
 * probability t: σ(logit(t) − change). With no change the prior is the probability (as in
 * mechanism.ts's moveFromPrior), so no rounding of ln and exp can move a range edge.
 */
function priorFor(t: number, change: number): number {
  return change === 0 ? t : logistic(logit(t) - change);
}

const clampLow = (x: number) => Math.max(PRIOR_CLAMP.min, x);
const clampHigh = (x: number) => Math.min(PRIOR_CLAMP.max, x);

/** Outcome priors that keep the verdict key (docs/scoring.md §9), E = the outcome's evidence log-odds. */
function outcomePriorRange(verdict: VerdictKey, evidence: number): PriorRange {
  const { notSupportedBelow, uncertainBelow } = VERDICT_THRESHOLDS;
  switch (verdict) {
    case 'insufficient':
      return { low: PRIOR_CLAMP.min, high: PRIOR_CLAMP.max };
    case 'not-supported':
      return { low: PRIOR_CLAMP.min, high: clampHigh(priorFor(notSupportedBelow, evidence)) };
    case 'uncertain':
      return {
        low: clampLow(priorFor(notSupportedBelow, evidence)),
        high: clampHigh(priorFor(uncertainBelow, evidence)),
      };
    default:
      return { low: clampLow(priorFor(uncertainBelow, evidence)), high: PRIOR_CLAMP.max };
  }
}

/** Mechanism priors that keep its likelihood term, L = evidence log-odds − dose penalty. */
function mechanismPriorRange(probability: number, change: number): PriorRange {
  const band = likelihoodBand(probability);
  const { min, max } = LIKELIHOOD_BANDS[band];
  return {
    low: band === 0 ? PRIOR_CLAMP.min : clampLow(priorFor(min, change)),
    high: band === LIKELIHOOD_BANDS.length - 1 ? PRIOR_CLAMP.max : clampHigh(priorFor(max, change)),
  };
}

/**
 * Robustness of a review's verdict (docs/scoring.md §9): leave-one-study-out, the pivotal
 * studies, the fragility (up to pairs), the prior ranges of the outcome and of every mechanism in
 * closed form, and the verdict with each appraisal's certainty one level lower and higher.
 *
 * @example
 * const high = { direction: 'supports', certainty: 'high', applicability: 1 } as const;
 * robustness({
 *   protocol: {},
 *   outcome: {
 *     evidence: [
 *       { ...high, studyId: 'S1' },
 *       { ...high, certainty: 'moderate', studyId: 'S2' },
 *       { ...high, direction: 'against', certainty: 'low', studyId: 'S3' },
 *     ],
 *   },
 *   mechanisms: [{ id: 'M1', stated: true, evidence: [{ ...high, studyId: 'S1' }] }],
 * });
 * // { verdict: 'supported', pivotal: ['S1'], fragility: 1, fragileSet: ['S1'],
 * //   outcomePriorRange: { low: 0.2425, high: 0.99 }, ... }
 */
export function robustness(input: ReviewInput): RobustnessResult {
  // scoreReview validates the whole input and gives the verdict every re-run is compared with.
  const base = scoreReview(input);
  const dosePenaltyById = new Map(base.mechanisms.map((m) => [m.id, m.dosePenalty]));
  const flat = flatten(input, dosePenaltyById);
  const { evaluate, whole } = makeEvaluator(flat);
  const verdict = base.verdict;

  const leaveOneOut: LeaveOneOutRow[] = flat.studies.map((studyId, s) => {
    const without = evaluate(s, NO_STUDY, NO_APPRAISAL, 0);
    return {
      studyId,
      verdict: without.verdict,
      outcomeProbability: without.outcomeProbability,
      changed: without.verdict !== verdict,
    };
  });
  const pivotal = leaveOneOut.filter((row) => row.changed).map((row) => row.studyId);

  let fragility: 1 | 2 | null = null;
  let fragileSet: string[] | null = null;
  if (pivotal.length > 0) {
    fragility = 1;
    fragileSet = [pivotal[0]];
  } else {
    search: for (let i = 0; i < flat.studies.length; i += 1) {
      for (let j = i + 1; j < flat.studies.length; j += 1) {
        if (evaluate(i, j, NO_APPRAISAL, 0).verdict !== verdict) {
          fragility = 2;
          fragileSet = [flat.studies[i], flat.studies[j]];
          break search;
        }
      }
    }
  }

  const certaintyShifts: CertaintyShift[] = [];
  const positionInList = new Array<number>(flat.owners.length).fill(0);
  for (let k = 0; k < flat.target.length; k += 1) {
    const t = flat.target[k];
    const slot = flat.slot[k];
    const direction = Math.floor(slot / 4);
    const level = slot % 4; // 0 high … 3 very-low
    const shiftTo = (to: number) =>
      to === level ? verdict : evaluate(NO_STUDY, NO_STUDY, k, direction * 4 + to).verdict;
    certaintyShifts.push({
      owner: flat.owners[t].owner,
      index: positionInList[t],
      down: shiftTo(Math.min(LOWEST_CERTAINTY, level + 1)),
      up: shiftTo(Math.max(0, level - 1)),
    });
    positionInList[t] += 1;
  }

  const probabilityById = new Map(base.mechanisms.map((m) => [m.id, m.probability]));
  return {
    verdict,
    leaveOneOut,
    pivotal,
    fragility,
    fragileSet,
    outcomePriorRange: outcomePriorRange(verdict, whole[0].change),
    mechanismPriorRanges: input.mechanisms.map((m, i) => ({
      id: m.id,
      ...mechanismPriorRange(probabilityById.get(m.id)!, whole[i + 1].change),
    })),
    certaintyShifts,
  };
}

import { EFFORT_SCALE, MIN_EVIDENCE_WEIGHT, VERDICT_LABEL, VERDICT_THRESHOLDS } from './constants';
import { ScoringInputError } from './errors';
import { formatNumber, formatPercent } from './format';
import { finishProbability, scoreMechanismAt, tallyEvidence } from './mechanism';
import type { MechanismInput } from './mechanism';
import { requireArray, requireFraction, requireKey, requireObject } from './validate';
import type { Appraisal, Effort, LikelihoodTerm, Magnitude, VerdictKey, WorkingStep } from './types';

/**
 * One candidate mechanism of a review: the mechanism input without the protocol fields (the
 * review's protocol supplies them), an id, and whether the claim names it as its reason.
 *
 * @example
 * const m: ReviewMechanismInput = {
 *   id: 'tendon-stiffness', stated: true, prior: 0.5, minIntensity: 0.7, minEffort: 'hard',
 *   evidence: [{ direction: 'supports', certainty: 'moderate', applicability: 0.8 }],
 * };
 */
export interface ReviewMechanismInput extends Omit<MechanismInput, 'protocolIntensity' | 'protocolEffort'> {
  id: string;
  stated?: boolean;
}

/**
 * A whole review as the verdict needs it.
 *
 * @example
 * const review: ReviewInput = {
 *   protocol: { intensity: 0.3, effort: 'easy' },
 *   outcome: { evidence: [{ direction: 'supports', certainty: 'high', applicability: 1 }] },
 *   mechanisms: [{ id: 'neural-drive', stated: true, evidence: [] }],
 * };
 */
export interface ReviewInput {
  protocol: { intensity?: number; effort?: Effort };
  /** Appraisals that test the claimed outcome directly (no mechanism). */
  outcome: { prior?: number; evidence: readonly Appraisal[] };
  mechanisms: readonly ReviewMechanismInput[];
}

/**
 * One mechanism in the verdict, in ranked order.
 *
 * @example
 * const row: RankedMechanism = {
 *   id: 'neural-drive', stated: false, rank: 1, probability: 0.8, term: 'likely',
 *   logOdds: 1.3863, dosePenalty: 0, expectedContribution: 0.4, share: 1,
 *   magnitude: 'moderate', steps: [],
 * };
 */
export interface RankedMechanism {
  id: string;
  stated: boolean;
  /** 1 = largest expected contribution. */
  rank: number;
  probability: number;
  term: LikelihoodTerm;
  logOdds: number;
  dosePenalty: number;
  expectedContribution: number;
  /** Fraction 0…1 of the summed expected contributions. */
  share: number;
  magnitude: Magnitude;
  steps: WorkingStep[];
}

/**
 * The verdict on a review, with all its working.
 *
 * @example
 * const result: ReviewScore = scoreReview({ protocol: {}, outcome: { evidence: [] }, mechanisms: [] });
 * result.verdict; // 'insufficient'
 */
export interface ReviewScore {
  outcome: { probability: number; term: LikelihoodTerm; logOdds: number; steps: WorkingStep[] };
  mechanisms: RankedMechanism[];
  evidenceWeight: number;
  verdict: VerdictKey;
  label: (typeof VERDICT_LABEL)[VerdictKey];
  steps: WorkingStep[];
}

/**
 * The first row of the verdict table (docs/scoring.md §5) that holds, from the three numbers it
 * reads: the evidence weight W, P_outcome, and whether some stated mechanism reaches 0.66.
 *
 * @example
 * verdictKey(2.9, 0.8584, true); // 'supported'
 * verdictKey(0.9, 0.8584, true); // 'insufficient'
 */
export function verdictKey(evidenceWeight: number, outcomeProbability: number, statedHolds: boolean): VerdictKey {
  if (evidenceWeight < MIN_EVIDENCE_WEIGHT) return 'insufficient';
  if (outcomeProbability < VERDICT_THRESHOLDS.notSupportedBelow) return 'not-supported';
  if (outcomeProbability < VERDICT_THRESHOLDS.uncertainBelow) return 'uncertain';
  return statedHolds ? 'supported' : 'other-reasons';
}

/**
 * Scores a review end to end (docs/scoring.md §3–§5): the claimed outcome from its direct appraisals
 * (no dose penalty), every mechanism under the review's protocol, the evidence weight W over all
 * appraisals, the verdict by the first row of §5's table that holds, and the mechanisms ranked by
 * expected contribution, then probability, then input order, with their shares.
 *
 * @example
 * const supports = { direction: 'supports', certainty: 'high', applicability: 1 } as const;
 * scoreReview({
 *   protocol: { intensity: 0.8, effort: 'hard' },
 *   outcome: { evidence: [supports, supports] },      // P_outcome = 16 / 17 = 0.9412
 *   mechanisms: [{ id: 'hypertrophy', stated: true, evidence: [supports] }], // p = 0.8
 * });
 * // { verdict: 'supported', label: 'Holds up', evidenceWeight: 3, ... }
 */
export function scoreReview(input: ReviewInput): ReviewScore {
  const raw = requireObject('review', input);
  const protocol = requireObject('protocol', raw.protocol);
  const protocolIntensity =
    protocol.intensity === undefined ? undefined : requireFraction('protocol.intensity', protocol.intensity);
  const protocolEffort =
    protocol.effort === undefined ? undefined : requireKey('protocol.effort', protocol.effort, EFFORT_SCALE);

  // The outcome: scored like a mechanism from its direct appraisals, with no dose penalty.
  const outcomeInput = requireObject('outcome', raw.outcome);
  const outcomeTally = tallyEvidence('outcome', outcomeInput.prior, outcomeInput.evidence);
  const outcomeSteps = outcomeTally.steps;
  const outcome = finishProbability(
    outcomeTally.prior,
    outcomeTally.priorLogOdds,
    outcomeTally.evidenceLogOdds,
    0,
    outcomeSteps,
  );

  const mechanismInputs = requireArray<unknown>('mechanisms', raw.mechanisms);
  const seen = new Set<string>();
  const scored = mechanismInputs.map((value, index) => {
    const field = `mechanisms[${index}]`;
    const m = requireObject(field, value);
    if (typeof m.id !== 'string' || m.id.trim() === '') {
      throw new ScoringInputError(`${field}.id`, 'must be a non-empty string');
    }
    if (seen.has(m.id)) throw new ScoringInputError(`${field}.id`, `"${m.id}" is used by two mechanisms`);
    seen.add(m.id);
    if (m.stated !== undefined && typeof m.stated !== 'boolean') {
      throw new ScoringInputError(`${field}.stated`, 'must be true or false');
    }
    const score = scoreMechanismAt(field, {
      prior: m.prior as number | undefined,
      evidence: m.evidence as readonly Appraisal[],
      minIntensity: m.minIntensity as number | undefined,
      minEffort: m.minEffort as Effort | undefined,
      magnitude: m.magnitude as Magnitude | undefined,
      protocolIntensity,
      protocolEffort,
    });
    return { id: m.id, stated: m.stated === true, index, score };
  });

  // Evidence weight over every appraisal of the review, neutral ones included.
  const mechanismWeight = scored.reduce((sum, m) => sum + m.score.evidenceWeight, 0);
  const evidenceWeight = outcomeTally.evidenceWeight + mechanismWeight;

  const ranked = [...scored].sort(
    (a, b) =>
      b.score.expectedContribution - a.score.expectedContribution ||
      b.score.probability - a.score.probability ||
      a.index - b.index,
  );
  const totalContribution = ranked.reduce((sum, m) => sum + m.score.expectedContribution, 0);
  const mechanisms: RankedMechanism[] = ranked.map((m, i) => ({
    id: m.id,
    stated: m.stated,
    rank: i + 1,
    probability: m.score.probability,
    term: m.score.term,
    logOdds: m.score.logOdds,
    dosePenalty: m.score.dosePenalty,
    expectedContribution: m.score.expectedContribution,
    share: totalContribution > 0 ? m.score.expectedContribution / totalContribution : 0,
    magnitude: m.score.magnitude,
    steps: m.score.steps,
  }));

  const steps: WorkingStep[] = [];
  steps.push({
    kind: 'outcome',
    text:
      `The claimed outcome, from ${outcomeTally.count} direct appraisal${outcomeTally.count === 1 ? '' : 's'}: ` +
      `P_outcome = ${formatNumber(outcome.probability)} (${outcome.term}); its working is listed with the outcome.`,
    values: { probability: outcome.probability, logOdds: outcome.logOdds, appraisals: outcomeTally.count },
  });
  steps.push({
    kind: 'evidence-weight',
    text:
      `Evidence weight W = Σ w(c) · a over every appraisal = ${formatNumber(outcomeTally.evidenceWeight)} (outcome) + ` +
      `${formatNumber(mechanismWeight)} (${scored.length} mechanism${scored.length === 1 ? '' : 's'}) = ` +
      `${formatNumber(evidenceWeight)}.`,
    values: { outcome: outcomeTally.evidenceWeight, mechanisms: mechanismWeight, evidenceWeight },
  });

  const stated = scored.filter((m) => m.stated);
  const holding = stated.filter((m) => m.score.probability >= VERDICT_THRESHOLDS.holds);
  const p = outcome.probability;
  const verdict = verdictKey(evidenceWeight, p, holding.length > 0);
  let why: string;
  if (verdict === 'insufficient') {
    why = `W = ${formatNumber(evidenceWeight)} is below ${formatNumber(MIN_EVIDENCE_WEIGHT)}`;
  } else if (verdict === 'not-supported') {
    why =
      `W = ${formatNumber(evidenceWeight)} ≥ ${formatNumber(MIN_EVIDENCE_WEIGHT)}; ` +
      `P_outcome = ${formatNumber(p)} is below ${formatNumber(VERDICT_THRESHOLDS.notSupportedBelow)}`;
  } else if (verdict === 'uncertain') {
    why =
      `W = ${formatNumber(evidenceWeight)} ≥ ${formatNumber(MIN_EVIDENCE_WEIGHT)}; P_outcome = ${formatNumber(p)} ` +
      `is at least ${formatNumber(VERDICT_THRESHOLDS.notSupportedBelow)} but below ${formatNumber(VERDICT_THRESHOLDS.uncertainBelow)}`;
  } else if (verdict === 'supported') {
    why =
      `W = ${formatNumber(evidenceWeight)} ≥ ${formatNumber(MIN_EVIDENCE_WEIGHT)}; P_outcome = ${formatNumber(p)} ≥ ` +
      `${formatNumber(VERDICT_THRESHOLDS.uncertainBelow)}; the stated mechanism ` +
      holding.map((m) => `"${m.id}" has p = ${formatNumber(m.score.probability)}`).join(', ') +
      ` ≥ ${formatNumber(VERDICT_THRESHOLDS.holds)}`;
  } else {
    why =
      `W = ${formatNumber(evidenceWeight)} ≥ ${formatNumber(MIN_EVIDENCE_WEIGHT)}; P_outcome = ${formatNumber(p)} ≥ ` +
      `${formatNumber(VERDICT_THRESHOLDS.uncertainBelow)}; ` +
      (stated.length === 0
        ? 'no mechanism is marked as the stated one'
        : `no stated mechanism reaches ${formatNumber(VERDICT_THRESHOLDS.holds)} (` +
          stated.map((m) => `"${m.id}" p = ${formatNumber(m.score.probability)}`).join(', ') +
          ')');
  }
  steps.push({
    kind: 'verdict',
    text: `${why} → ${VERDICT_LABEL[verdict]}.`,
    values: { evidenceWeight, outcomeProbability: p, statedHolding: holding.length },
  });

  for (const m of mechanisms) {
    steps.push({
      kind: 'contribution',
      text:
        `#${m.rank} "${m.id}"${m.stated ? ' (stated)' : ''}: p ${formatNumber(m.probability)} (${m.term}) × ` +
        `magnitude ${m.magnitude} = ${formatNumber(m.expectedContribution)}; share ` +
        (totalContribution > 0
          ? `${formatNumber(m.expectedContribution)} / ${formatNumber(totalContribution)} = ${formatPercent(m.share)}.`
          : '0 (no mechanism is expected to contribute anything).'),
      values: {
        rank: m.rank,
        probability: m.probability,
        expectedContribution: m.expectedContribution,
        totalContribution,
        share: m.share,
      },
    });
  }

  return {
    outcome: { probability: outcome.probability, term: outcome.term, logOdds: outcome.logOdds, steps: outcomeSteps },
    mechanisms,
    evidenceWeight,
    verdict,
    label: VERDICT_LABEL[verdict],
    steps,
  };
}

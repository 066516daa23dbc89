import { Op, type Transaction } from 'sequelize';
import { Appraisal, Mechanism, Review, Study } from '@/models';
import { scoreMechanism, scoreReview, type ReviewInput, type ReviewScore } from '@/lib/scoring';
import type { DowngradeDomain } from '@/lib/scoring/appraisal-vocabulary';
import { sessionSpacingOk, weeklyTimeUnderLoad } from '@/lib/training/dose';
import { outcomeEffectCheck } from './effect-check';
import { deriveAppraisal, type DerivedAppraisal, type StudyFacts } from './derive';
import { convertLoad } from './protocol';
import { robustnessFromScored } from './robustness';
import { appraisalFacts, targetFacts, toProtocolDTO } from './rows';
import type {
  AppraisalWorkingDTO,
  DoseCheckDTO,
  Effort,
  Magnitude,
  StudyDesign,
  TrainingStatus,
  VerdictDTO,
} from './types';

/**
 * The verdict of a review: loads the review's rows as plain data and hands them to lib/scoring
 * (which never loads anything itself, docs/architecture.md). Also keeps the cached verdict key on
 * the review row, which the dashboard lists and filters by.
 */

/**
 * The rows a verdict needs, as plain shapes: model instances fit them, and so do the demo
 * seed's in-memory rows (db/seeders), which are scored before they are written.
 */
export interface ReviewFacts {
  id: number;
  protocol: Record<string, unknown>;
  populationStatus: string | null;
  populationInjured: boolean;
}
export interface MechanismFacts {
  id: number;
  name: string;
  stated: boolean;
  prior: number;
  minIntensity: number | null;
  minEffort: string | null;
  magnitude: string;
}
export interface AppraisalRowFacts extends Record<DowngradeDomain, string> {
  id: number;
  studyId: number;
  mechanismId: number | null;
  direction: string;
  largeEffect: number;
  doseResponse: boolean;
  confoundingWouldReduce: boolean;
  applicabilityOverride: number | null;
}
export interface StudyRowFacts {
  id: number;
  /** Author–year; the seed's in-memory rows may lack it. */
  citation?: string;
  design: string | null;
  population: string | null;
  injured: boolean;
  intensity: number | null;
}

export interface ReviewData<
  R extends ReviewFacts = Review,
  M extends MechanismFacts = Mechanism,
  A extends AppraisalRowFacts = Appraisal,
  S extends StudyRowFacts = Study,
> {
  review: R;
  mechanisms: M[];
  appraisals: A[];
  studies: Map<number, S>;
}
export type AnyReviewData = ReviewData<ReviewFacts, MechanismFacts, AppraisalRowFacts, StudyRowFacts>;

export async function loadReviewData(reviewId: number, transaction?: Transaction): Promise<ReviewData | null> {
  const review = await Review.findByPk(reviewId, { transaction });
  if (!review) return null;
  const [mechanisms, appraisals] = await Promise.all([
    Mechanism.findAll({
      where: { reviewId },
      order: [
        ['position', 'ASC'],
        ['id', 'ASC'],
      ],
      transaction,
    }),
    Appraisal.findAll({ where: { reviewId }, order: [['id', 'ASC']], transaction }),
  ]);
  const studyIds = [...new Set(appraisals.map((a) => a.studyId))];
  const studies = studyIds.length ? await Study.findAll({ where: { id: { [Op.in]: studyIds } }, transaction }) : [];
  return { review, mechanisms, appraisals, studies: new Map(studies.map((s) => [s.id, s])) };
}

export function studyFacts(study: StudyRowFacts): StudyFacts {
  return {
    design: study.design as StudyDesign | null,
    population: study.population as TrainingStatus | null,
    injured: study.injured,
    intensity: study.intensity,
  };
}

/** Every appraisal's certainty and applicability, by appraisal id. */
export function deriveAll(data: AnyReviewData): Map<number, DerivedAppraisal> {
  const target = targetFacts(data.review);
  const out = new Map<number, DerivedAppraisal>();
  for (const a of data.appraisals) {
    const study = data.studies.get(a.studyId);
    if (!study) continue;
    out.set(a.id, deriveAppraisal(appraisalFacts(a), studyFacts(study), target));
  }
  return out;
}

/**
 * The engine speaks of mechanisms by a string id and writes it into its working ("the stated
 * mechanism "…" has p = …"), so we give it each mechanism's name — suffixed when two share one —
 * and map the rows back afterwards.
 */
function engineIds(mechanisms: MechanismFacts[]): Map<number, string> {
  const used = new Map<string, number>();
  const ids = new Map<number, string>();
  for (const m of mechanisms) {
    const n = (used.get(m.name) ?? 0) + 1;
    used.set(m.name, n);
    ids.set(m.id, n === 1 ? m.name : `${m.name} (${n})`);
  }
  return ids;
}

export interface ScoredReview {
  input: ReviewInput;
  score: ReviewScore;
  derived: Map<number, DerivedAppraisal>;
  ids: Map<number, string>;
  /** Appraisal ids in the engine's reading order: the outcome's, then each mechanism's in order. */
  appraisalOrder: number[];
}

/** Pure: plain rows in, the engine's score out. */
export function scoreReviewData(data: AnyReviewData): ScoredReview {
  const derived = deriveAll(data);
  const protocol = toProtocolDTO(data.review.protocol);
  const ids = engineIds(data.mechanisms);
  const appraisalOrder: number[] = [];
  const evidenceOf = (mechanismId: number | null) =>
    data.appraisals
      .filter((a) => a.mechanismId === mechanismId && derived.has(a.id))
      .map((a) => {
        appraisalOrder.push(a.id);
        const d = derived.get(a.id)!;
        // The study id lets robustness (docs/scoring.md §9) leave a whole study out at once.
        return {
          direction: appraisalFacts(a).direction,
          certainty: d.certainty.level,
          applicability: d.applicability,
          studyId: String(a.studyId),
        };
      });
  // The outcome's list first, then each mechanism's, as the engine reads them (appraisalOrder).
  const outcomeEvidence = evidenceOf(null);
  const input: ReviewInput = {
    protocol: {
      intensity: protocol.intensity ?? undefined,
      effort: protocol.effort ?? undefined,
    },
    outcome: { evidence: outcomeEvidence },
    mechanisms: data.mechanisms.map((m) => ({
      id: ids.get(m.id)!,
      stated: m.stated,
      prior: m.prior,
      evidence: evidenceOf(m.id),
      minIntensity: m.minIntensity ?? undefined,
      minEffort: (m.minEffort as Effort | null) ?? undefined,
      magnitude: m.magnitude as Magnitude,
    })),
  };
  return { input, score: scoreReview(input), derived, ids, appraisalOrder };
}

/** The protocol's dose against every mechanism's minimum (docs/scoring.md §3 and §8). */
export function doseCheck(data: AnyReviewData): DoseCheckDTO {
  const protocol = toProtocolDTO(data.review.protocol);
  const { secondsPerSet, setsPerSession, sessionsPerDay, daysPerWeek, minHoursBetween } = protocol;
  return {
    protocolIntensity: protocol.intensity,
    intensityExplanation: convertLoad(protocol).explanation,
    protocolEffort: protocol.effort,
    weeklySecondsUnderLoad:
      secondsPerSet !== null && setsPerSession !== null && sessionsPerDay !== null
        ? weeklyTimeUnderLoad({ secondsPerSet, setsPerSession, sessionsPerDay, daysPerWeek: daysPerWeek ?? undefined })
        : null,
    spacing:
      sessionsPerDay !== null && minHoursBetween !== null
        ? sessionSpacingOk({ sessionsPerDay, minHoursBetween })
        : null,
    perMechanism: data.mechanisms.map((m) => {
      // The shortfalls are the engine's (scoreMechanism); evidence plays no part in them.
      const scored = scoreMechanism({
        evidence: [],
        minIntensity: m.minIntensity ?? undefined,
        minEffort: (m.minEffort as Effort | null) ?? undefined,
        protocolIntensity: protocol.intensity ?? undefined,
        protocolEffort: protocol.effort ?? undefined,
      });
      return {
        id: m.id,
        name: m.name,
        minIntensity: m.minIntensity,
        minEffort: m.minEffort as Effort | null,
        intensityShortfall: scored.shortfall.intensity,
        effortShortfall: scored.shortfall.effort,
        dosePenalty: scored.dosePenalty,
      };
    }),
  };
}

/** GET /api/reviews/:id/verdict: the engine's full output with rows' ids, the dose check and each appraisal's working. */
export function verdictFromData(data: AnyReviewData): VerdictDTO {
  const scored = scoreReviewData(data);
  const { score, derived, ids } = scored;
  const byEngineId = new Map([...ids].map(([rowId, engineId]) => [engineId, rowId]));
  const names = new Map(data.mechanisms.map((m) => [m.id, m.name]));
  const appraisals: AppraisalWorkingDTO[] = data.appraisals
    .filter((a) => derived.has(a.id))
    .map((a) => {
      const d = derived.get(a.id)!;
      return {
        id: a.id,
        studyId: a.studyId,
        mechanismId: a.mechanismId,
        direction: appraisalFacts(a).direction,
        certainty: d.certainty.level,
        certaintyScore: d.certainty.score,
        certaintySteps: d.certainty.steps,
        certaintyNotes: d.certainty.notes,
        suggestedApplicability: d.suggestion.applicability,
        applicabilityReason: d.suggestion.text,
        applicability: d.applicability,
        overridden: d.overridden,
        logOddsTerm: d.logOddsTerm,
      };
    });
  return {
    outcome: score.outcome,
    mechanisms: score.mechanisms.map((m) => {
      const id = byEngineId.get(m.id)!;
      return { ...m, id, name: names.get(id)! };
    }),
    evidenceWeight: score.evidenceWeight,
    verdict: score.verdict,
    label: score.label,
    steps: score.steps,
    dose: doseCheck(data),
    appraisals,
    robustness: robustnessFromScored(data, scored),
  };
}

export async function reviewVerdict(reviewId: number): Promise<VerdictDTO | null> {
  const data = await loadReviewData(reviewId);
  if (!data) return null;
  const verdict = verdictFromData(data);
  return { ...verdict, effectCheck: outcomeEffectCheck(data, verdict.outcome.probability) };
}

/**
 * Recomputes and stores the cached verdict key. `touch` also moves the review's updatedAt (a
 * change to the review's own mechanisms or appraisals); a change to a shared study does not.
 * Returns the scoring, whose per-appraisal grading a write answers with (graded once a write).
 */
export async function refreshVerdict(
  reviewId: number,
  options: { transaction?: Transaction; touch?: boolean } = {},
): Promise<ScoredReview | null> {
  const data = await loadReviewData(reviewId, options.transaction);
  if (!data) return null;
  const scored = scoreReviewData(data);
  await Review.update(
    { verdict: scored.score.verdict },
    { where: { id: reviewId }, transaction: options.transaction, silent: !options.touch },
  );
  return scored;
}

/** After a study changed: every review that appraises it. */
export async function refreshVerdictsOfStudy(studyId: number, transaction?: Transaction): Promise<void> {
  const rows = await Appraisal.findAll({
    where: { studyId },
    attributes: ['reviewId'],
    group: ['reviewId'],
    transaction,
  });
  for (const row of rows) await refreshVerdict(row.reviewId, { transaction });
}

import type { EvidenceNotice } from '@/lib/watch/notices';

/**
 * The shapes the workbench's routes send and its pages read. Written first so the server side
 * (lib/reviews, lib/library, app/api) and the client side (components, pages) agree. Fractions
 * are 0…1 everywhere (intensity, prior, applicability), as in docs/scoring.md.
 */

import type { Direction, Effort, Magnitude } from '@/lib/scoring/types';
import type { CertaintyLevel, Concern, StudyDesign, TrainingStatus, VerdictKey } from '@/lib/scoring/types';
import type { EffectCheckDTO } from './effect-check';
import type { DowngradeDomain, LargeEffect } from '@/lib/scoring/appraisal-vocabulary';

export const LOAD_UNITS = ['percent-max', 'percent-1rm', 'percent-mvc', 'percent-bodyweight', 'kg-added'] as const;
export type LoadUnit = (typeof LOAD_UNITS)[number];

// The model's own vocabularies come from the scoring engine, so the two can never drift apart.
export { STUDY_DESIGNS, TRAINING_STATUSES } from '@/lib/scoring/constants';
export { CONCERN_LEVELS as CONCERNS } from '@/lib/scoring/constants';
export type { Concern, Direction, Effort, Magnitude, StudyDesign, TrainingStatus } from '@/lib/scoring/types';

/** In the order a form lists them. */
export const EFFORTS = ['easy', 'moderate', 'hard', 'to-failure'] as const satisfies readonly Effort[];
export const MAGNITUDES = ['none', 'small', 'moderate', 'large'] as const satisfies readonly Magnitude[];
export const DIRECTIONS = ['supports', 'against', 'neutral'] as const satisfies readonly Direction[];

export const REVIEW_STATUSES = ['draft', 'in-review', 'approved', 'published', 'archived'] as const;
export type ReviewStatus = (typeof REVIEW_STATUSES)[number];

export const MECHANISM_KINDS = ['physiological', 'perceptual', 'skill', 'non-specific'] as const;
export type MechanismKind = (typeof MECHANISM_KINDS)[number];

export type { CertaintyLevel } from '@/lib/scoring/types';

/** The claim's dose, as the coach entered it, plus the one intensity scale the scoring uses. */
export interface ProtocolDTO {
  exercise: string;
  loadValue: number | null;
  loadUnit: LoadUnit | null;
  /** Reference athlete, needed to convert % body weight and kg added to a fraction of maximum. */
  referenceBodyweightKg: number | null;
  referenceMaxAddedKg: number | null;
  secondsPerSet: number | null;
  setsPerSession: number | null;
  sessionsPerDay: number | null;
  daysPerWeek: number | null;
  minHoursBetween: number | null;
  weeks: number | null;
  effort: Effort | null;
  /** Derived: load as a fraction of the athlete's maximum (0…1), null when it cannot be converted. */
  intensity: number | null;
}

export interface PopulationDTO {
  status: TrainingStatus | null;
  injured: boolean;
}

export interface RecommendationsDTO {
  whoMightTry: string;
  whoShouldNot: string;
  whatInstead: string;
}

export interface ReviewSummaryDTO {
  id: number;
  teamId: number;
  title: string;
  slug: string;
  claim: string;
  status: ReviewStatus;
  verdict: VerdictKey | null;
  verdictLabel: string | null;
  tags: string[];
  authorId: number;
  authorName: string;
  updatedAt: string;
}

export interface ReviewDTO extends ReviewSummaryDTO {
  claimSource: string;
  claimUrl: string | null;
  protocol: ProtocolDTO;
  population: PopulationDTO;
  /** Tiptap (ProseMirror) JSON document. */
  body: Record<string, unknown>;
  recommendations: RecommendationsDTO;
  /** Optimistic-locking counter: send it back with every PATCH; a stale one gets 409. */
  /** Which way the claimed outcome's measure is desirable (docs/scoring.md §10). */
  outcomeDesirable: 'higher' | 'lower';
  version: number;
  createdAt: string;
}

export interface MechanismDTO {
  id: number;
  reviewId: number;
  name: string;
  kind: MechanismKind;
  summary: string;
  minIntensity: number | null;
  minEffort: Effort | null;
  prior: number;
  magnitude: Magnitude;
  stated: boolean;
  /** Which way this mechanism's measure is desirable (docs/scoring.md §10). */
  desirable: 'higher' | 'lower';
  position: number;
}

/** Effect data as reported by a study; the route computes the comparable effect size from it. */
export type EffectDataDTO =
  | { kind: 'means'; m1: number; sd1: number; n1: number; m2: number; sd2: number; n2: number }
  | { kind: 't'; t: number; n1: number; n2: number }
  | { kind: 'two-by-two'; a: number; b: number; c: number; d: number; measure: 'risk-ratio' | 'odds-ratio' }
  | { kind: 'ready'; effectSize: number; variance: number; measure: 'smd' | 'log-risk-ratio' | 'log-odds-ratio' };

export interface StudyDTO {
  id: number;
  teamId: number;
  /** CSL-JSON item, the reference as citation-js reads and writes it. */
  csl: Record<string, unknown>;
  doi: string | null;
  title: string;
  /** Author–year form for inline citations, e.g. "Holt & Wren, 2024" or "Holt et al., 2023". */
  citation: string;
  year: number | null;
  journal: string | null;
  design: StudyDesign | null;
  /** The design the title or keywords name (lib/citations/design.ts), while no design is set; the coach confirms it. */
  suggestedDesign: StudyDesign | null;
  population: TrainingStatus | null;
  injured: boolean;
  n: number | null;
  intensity: number | null;
  durationWeeks: number | null;
  outcome: string | null;
  effect: EffectDataDTO | null;
  tags: string[];
  hasPdf: boolean;
  createdAt: string;
  /** How many appraisals (in any review of the team) use this study. */
  appraisalCount: number;
  /** The most serious update notice the evidence watch found (retraction, correction …), or null. */
  notice: EvidenceNotice | null;
}

export interface AppraisalDTO extends Record<DowngradeDomain, Concern> {
  id: number;
  reviewId: number;
  studyId: number;
  /** null: the appraisal tests the claimed outcome itself. */
  mechanismId: number | null;
  direction: Direction;
  largeEffect: LargeEffect;
  doseResponse: boolean;
  confoundingWouldReduce: boolean;
  applicabilityOverride: number | null;
  overrideReason: string | null;
  /** Why the direction differs from the one the study's effect suggests. */
  directionReason: string | null;
  /** Stored before each certainty domain had its own column: a coach must check and save it. */
  needsCheck: boolean;
  notes: string;
  /** Derived by the scoring engine. */
  certainty: CertaintyLevel;
  suggestedApplicability: number;
  /** The override when set, else the suggestion. */
  applicability: number;
}

export type { VerdictKey } from '@/lib/scoring/types';

/** GET /api/reviews/:id — everything the workbench needs in one read. */
export interface WorkbenchDTO {
  review: ReviewDTO;
  mechanisms: MechanismDTO[];
  appraisals: AppraisalDTO[];
  /** The library studies this review's appraisals point at. */
  studies: StudyDTO[];
  /** Studies cited inline in the body (citation nodes), same team only; may overlap `studies`. */
  citedStudies: StudyDTO[];
  /** Mechanisms (or the outcome, null) with two or more compatible effect sizes: forest plots to offer. */
  poolable: PoolableDTO[];
}

/** One entry's fate in a library import. */
export interface ImportResultDTO {
  /** 0-based position of the entry in the pasted text or file. */
  index: number;
  title: string | null;
  status: 'added' | 'duplicate' | 'failed';
  studyId?: number;
  reason?: string;
  /** For an added or matched study with no design yet: the design its title or keywords name. */
  suggestedDesign?: StudyDesign;
}

// ---------------------------------------------------------------------------------------------
// ---------------------------------------------------------------------------------------------

/** One line of the scoring engine's working: a sentence with its numbers (lib/scoring WorkingStep). */
export interface WorkingStepDTO {
  kind: string;
  text: string;
  values: Record<string, number>;
}

/** One step of an appraisal's certainty grading (lib/scoring CertaintyStep). */
export interface CertaintyStepDTO {
  domain: string;
  /** For the first step ('design') the starting score; otherwise levels added (+) or removed (−). */
  change: number;
  reason: string;
  /** Running score after this step, 1…4. */
  score: number;
}

/** A mechanism in the verdict, ranked (1 = largest expected contribution). */
export interface VerdictMechanismDTO {
  id: number;
  name: string;
  stated: boolean;
  rank: number;
  probability: number;
  term: string;
  logOdds: number;
  dosePenalty: number;
  expectedContribution: number;
  /** Fraction 0…1 of the summed expected contributions. */
  share: number;
  magnitude: Magnitude;
  steps: WorkingStepDTO[];
}

export interface DoseCheckMechanismDTO {
  id: number;
  name: string;
  minIntensity: number | null;
  minEffort: Effort | null;
  /** max(0, (I_min − I_protocol) / I_min); 0 when either is unknown. */
  intensityShortfall: number;
  /** max(0, (E_min − E_protocol) / 3); 0 when either is unknown. */
  effortShortfall: number;
  dosePenalty: number;
}

/** The protocol's dose against each mechanism's minimum stimulus (docs/scoring.md §3, §8). */
export interface DoseCheckDTO {
  protocolIntensity: number | null;
  /** How the load became a fraction of maximum, in one sentence. */
  intensityExplanation: string;
  protocolEffort: Effort | null;
  /** null when seconds per set, sets or sessions per day are not given. */
  weeklySecondsUnderLoad: number | null;
  /** null when sessions per day or minimum hours between sessions are not given. */
  spacing: { ok: boolean; hoursNeeded: number } | null;
  perMechanism: DoseCheckMechanismDTO[];
}

/** How one appraisal's certainty and applicability were reached, for the "how" panels. */
export interface AppraisalWorkingDTO {
  id: number;
  studyId: number;
  mechanismId: number | null;
  direction: Direction;
  certainty: CertaintyLevel;
  certaintyScore: number;
  certaintySteps: CertaintyStepDTO[];
  /** Upgrades that were ticked but could not apply, and why. */
  certaintyNotes: string[];
  suggestedApplicability: number;
  /** The population and dose reasons behind the suggestion. */
  applicabilityReason: string;
  applicability: number;
  overridden: boolean;
  /** This appraisal's term in the log-odds sum: s · w(c) · a · ln 4. */
  logOddsTerm: number;
}

/** GET /api/reviews/:id/verdict — lib/scoring's scoreReview output (mechanism ids mapped back to rows), plus the dose check and each appraisal's working. */
export interface VerdictDTO {
  outcome: { probability: number; term: string; logOdds: number; steps: WorkingStepDTO[] };
  mechanisms: VerdictMechanismDTO[];
  evidenceWeight: number;
  verdict: VerdictKey;
  label: string;
  steps: WorkingStepDTO[];
  dose: DoseCheckDTO;
  appraisals: AppraisalWorkingDTO[];
  /** The claimed outcome's pooled effect against its probability (GET /verdict only). */
  effectCheck?: EffectCheckDTO | null;
  /** What the verdict hangs on (docs/scoring.md §9); blind like every engine number. */
  robustness: RobustnessDTO;
}

/** The verdict without one study (docs/scoring.md §9, leave-one-out). */
export interface LeaveOneOutDTO {
  studyId: number;
  /** Author–year. */
  citation: string;
  verdict: VerdictKey;
  /** P_outcome without that study. */
  outcomeProbability: number;
  changed: boolean;
}

/** Priors 0.01…0.99 over which the verdict key (outcome) or the likelihood term (mechanism) stays the same. */
export interface PriorRangeDTO {
  /** The prior the review uses now. */
  prior: number;
  low: number;
  high: number;
}

/** An appraisal whose certainty, one level lower or higher, changes the verdict. */
export interface DecidingCertaintyDTO {
  appraisalId: number;
  studyId: number;
  citation: string;
  /** null = the claimed outcome. */
  mechanismId: number | null;
  certainty: CertaintyLevel;
  /** The verdict one level lower / higher (equal to the verdict when that way changes nothing). */
  down: VerdictKey;
  up: VerdictKey;
}

/** GET /api/reviews/:id/verdict → robustness: lib/scoring's robustness() with rows' ids and citations. */
export interface RobustnessDTO {
  /** Smallest number of studies (up to 2) whose removal together changes the verdict; null: none. */
  fragility: 1 | 2 | null;
  /** The first such set of study ids. */
  fragileSet: number[] | null;
  /** One row per appraised study, in study order (the outcome's appraisals first). */
  leaveOneOut: LeaveOneOutDTO[];
  /** Study ids whose removal alone changes the verdict. */
  pivotal: number[];
  outcomePrior: PriorRangeDTO;
  /** In the review's mechanism order. */
  mechanismPriors: (PriorRangeDTO & { mechanismId: number })[];
  decidingCertainty: DecidingCertaintyDTO[];
}

/** The two families of effect size the meta-analysis pools, never together (lib/reviews/meta.ts). */
export type EffectMeasure = 'smd' | 'log-risk-ratio';

/** A target (mechanism or the outcome) with two or more compatible effect sizes: a forest plot can be drawn. */
export interface PoolableDTO {
  mechanismId: number | null;
  measure: EffectMeasure;
  k: number;
}

/** lib/stats metaAnalysis output, as sent. */
export interface MetaAnalysisStatsDTO {
  k: number;
  method: 'fixed' | 'DL' | 'REML';
  estimate: number;
  se: number;
  ci: [number, number];
  z: number;
  p: number;
  Q: number;
  df: number;
  pQ?: number;
  tau2: number;
  I2: number;
  H2?: number;
  /** Percent of the total weight per study, in the order of `studies`. */
  weights: number[];
  predictionInterval?: [number, number];
}

/** One row of the forest plot. */
export interface ForestRowDTO {
  appraisalId: number;
  studyId: number;
  citation: string;
  direction: Direction;
  effectSize: number;
  variance: number;
  ciLow: number;
  ciHigh: number;
  /** Random-effects weight, percent. */
  weight: number;
  /** Fixed-effect weight, percent. */
  fixedWeight: number;
  /** The effect data it came from, and whether it was converted to the pooled scale. */
  source: EffectDataDTO['kind'];
  converted: boolean;
}

/** GET /api/reviews/:id/meta-analysis?mechanism=<id>|outcome */
export interface MetaAnalysisDTO {
  mechanismId: number | null;
  /** The mechanism's name, or "Claimed outcome". */
  target: string;
  k: number;
  measure: EffectMeasure;
  /** "Standardized mean difference (Hedges' g)" or "Log risk ratio". */
  measureLabel: string;
  /**
   * Which way the target's measure is desirable. Every effect, interval and pooled estimate here
   * is oriented so that a positive value is the claimed benefit (docs/scoring.md §10).
   */
  desirable: 'higher' | 'lower';
  studies: ForestRowDTO[];
  fixed: MetaAnalysisStatsDTO;
  random: MetaAnalysisStatsDTO;
  /** Appraisals of the target left out, and why (no effect data, the other family). */
  excluded: { appraisalId: number; studyId: number; citation: string; reason: string }[];
}

/** GET /api/studies */
export interface StudyListDTO {
  studies: StudyDTO[];
  total: number;
  page: number;
  pageSize: number;
}

/** An appraisal of a study in some review of the team, for the study page. */
export interface StudyAppraisalDTO extends AppraisalDTO {
  reviewTitle: string;
  /** null: the claimed outcome. */
  mechanismName: string | null;
}

/** GET /api/studies/:id */
export interface StudyDetailDTO {
  study: StudyDTO;
  appraisals: StudyAppraisalDTO[];
}

/** GET /api/studies/:id/citation?format=… */
export interface CitationDTO {
  format: 'apa' | 'bibtex' | 'ris' | 'csl';
  mediaType: string;
  filename: string;
  text: string;
  /** APA only: with the italics APA sets. */
  html?: string;
}

/** 409 body of PATCH /api/reviews/:id with a stale version. */
export interface ReviewConflictDTO {
  error: string;
  current: ReviewDTO;
}

/** 409 body of DELETE /api/studies/:id when appraisals use the study (send ?force=1 to delete them too). */
export interface StudyInUseDTO {
  error: string;
  appraisalCount: number;
  reviews: { id: number; title: string }[];
}

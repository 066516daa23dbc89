/**
 * The shapes the workbench's routes send and its pages read. Written first so the server side
 * (lib/reviews, lib/library, app/api) and the client side (components, pages) agree. Fractions
 * are 0…1 everywhere (intensity, prior, applicability), as in SCORING.md.
 */

export const LOAD_UNITS = ['percent-max', 'percent-1rm', 'percent-mvc', 'percent-bodyweight', 'kg-added'] as const;
export type LoadUnit = (typeof LOAD_UNITS)[number];

export const EFFORTS = ['easy', 'moderate', 'hard', 'to-failure'] as const;
export type Effort = (typeof EFFORTS)[number];

export const TRAINING_STATUSES = ['untrained', 'recreational', 'trained', 'elite'] as const;
export type TrainingStatus = (typeof TRAINING_STATUSES)[number];

export const REVIEW_STATUSES = ['draft', 'in-review', 'approved', 'published', 'archived'] as const;
export type ReviewStatus = (typeof REVIEW_STATUSES)[number];

export const MAGNITUDES = ['none', 'small', 'moderate', 'large'] as const;
export type Magnitude = (typeof MAGNITUDES)[number];

export const DIRECTIONS = ['supports', 'against', 'neutral'] as const;
export type Direction = (typeof DIRECTIONS)[number];

export const CONCERNS = ['none', 'serious', 'very-serious'] as const;
export type Concern = (typeof CONCERNS)[number];

export const STUDY_DESIGNS = [
  'meta-analysis',
  'randomized',
  'non-randomized',
  'cohort',
  'case-control',
  'cross-sectional',
  'case-series',
  'case-report',
  'expert-opinion',
  'animal',
  'in-vitro',
] as const;
export type StudyDesign = (typeof STUDY_DESIGNS)[number];

export const MECHANISM_KINDS = ['physiological', 'perceptual', 'skill', 'non-specific'] as const;
export type MechanismKind = (typeof MECHANISM_KINDS)[number];

export type CertaintyLevel = 'high' | 'moderate' | 'low' | 'very-low';

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
  position: number;
}

/** Effect data as reported by a study; the route computes the comparable effect size from it. */
export type EffectDataDTO =
  | { kind: 'means'; m1: number; sd1: number; n1: number; m2: number; sd2: number; n2: number }
  | { kind: 't'; t: number; n1: number; n2: number }
  | { kind: 'two-by-two'; a: number; b: number; c: number; d: number; measure: 'risk-ratio' | 'odds-ratio' }
  | { kind: 'ready'; yi: number; vi: number; measure: 'smd' | 'log-risk-ratio' | 'log-odds-ratio' };

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
}

export interface AppraisalDTO {
  id: number;
  reviewId: number;
  studyId: number;
  /** null: the appraisal tests the claimed outcome itself. */
  mechanismId: number | null;
  direction: Direction;
  riskOfBias: Concern;
  inconsistency: Concern;
  indirectness: Concern;
  imprecision: Concern;
  publicationBias: Concern;
  largeEffect: 0 | 1 | 2;
  doseResponse: boolean;
  confoundingWouldReduce: boolean;
  applicabilityOverride: number | null;
  overrideReason: string | null;
  notes: string;
  /** Derived by the scoring engine. */
  certainty: CertaintyLevel;
  suggestedApplicability: number;
  /** The override when set, else the suggestion. */
  applicability: number;
}

export type VerdictKey = 'insufficient' | 'not-supported' | 'uncertain' | 'supported' | 'other-reasons';

/** GET /api/reviews/:id — everything the workbench needs in one read. */
export interface WorkbenchDTO {
  review: ReviewDTO;
  mechanisms: MechanismDTO[];
  appraisals: AppraisalDTO[];
  /** The library studies this review's appraisals point at. */
  studies: StudyDTO[];
}

/** One entry's fate in a library import. */
export interface ImportResultDTO {
  index: number;
  title: string | null;
  status: 'added' | 'duplicate' | 'failed';
  studyId?: number;
  reason?: string;
}

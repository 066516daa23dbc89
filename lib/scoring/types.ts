import type {
  CERTAINTY_LEVELS,
  CONCERN_LEVELS,
  DIRECTION_SIGN,
  EFFORT_SCALE,
  LIKELIHOOD_SCALE,
  MAGNITUDE_VALUE,
  STUDY_DESIGNS,
  TRAINING_STATUSES,
  VERDICT_KEYS,
} from './constants';

/**
 * A study design as spelled in docs/scoring.md §1.
 *
 * @example
 * const design: StudyDesign = 'cohort';
 */
export type StudyDesign = (typeof STUDY_DESIGNS)[number];

/**
 * A GRADE concern for one downgrade domain.
 *
 * @example
 * const risk: Concern = 'serious';
 */
export type Concern = (typeof CONCERN_LEVELS)[number];

/**
 * A certainty level, as an appraisal stores it.
 *
 * @example
 * const certainty: CertaintyLevel = 'very-low';
 */
export type CertaintyLevel = (typeof CERTAINTY_LEVELS)[number];

/**
 * Which way an appraisal points.
 *
 * @example
 * const direction: Direction = 'against';
 */
export type Direction = keyof typeof DIRECTION_SIGN;

/**
 * How hard a protocol asks the athlete to work, or how hard a mechanism needs them to.
 *
 * @example
 * const effort: Effort = 'to-failure';
 */
export type Effort = keyof typeof EFFORT_SCALE;

/**
 * How big an effect a mechanism would have, on Cohen's benchmarks.
 *
 * @example
 * const magnitude: Magnitude = 'small';
 */
export type Magnitude = keyof typeof MAGNITUDE_VALUE;

/**
 * Training status of a population.
 *
 * @example
 * const status: TrainingStatus = 'recreational';
 */
export type TrainingStatus = (typeof TRAINING_STATUSES)[number];

/**
 * One of the seven calibrated likelihood terms.
 *
 * @example
 * const term: LikelihoodTerm = 'about as likely as not';
 */
export type LikelihoodTerm = (typeof LIKELIHOOD_SCALE)[number]['term'];

/**
 * A verdict key of docs/scoring.md §5.
 *
 * @example
 * const verdict: VerdictKey = 'other-reasons';
 */
export type VerdictKey = (typeof VERDICT_KEYS)[number];

/**
 * One appraisal as the model sees it: which way it points, how certain it is, how well it
 * speaks to this protocol and population.
 *
 * @example
 * const appraisal: Appraisal = { direction: 'supports', certainty: 'moderate', applicability: 0.75 };
 */
export interface Appraisal {
  direction: Direction;
  certainty: CertaintyLevel;
  /** 0…1 */
  applicability: number;
  /**
   * The study the appraisal reads, so that robustness (docs/scoring.md §9) can leave a whole study
   * out of the outcome and every mechanism at once. Without one the appraisal is its own study.
   */
  studyId?: string;
}

/**
 * One line of working: a sentence a person can follow, and the numbers it uses by name, so the
 * verdict page can show how a number was reached and a reviewer can redo it by hand.
 *
 * @example
 * const step: WorkingStep = {
 *   kind: 'prior',
 *   text: 'Prior plausibility 0.5 → log-odds ln(0.5 / 0.5) = 0.',
 *   values: { prior: 0.5, logOdds: 0 },
 * };
 */
export interface WorkingStep {
  /** A stable key the interface can group or style by. */
  kind: string;
  /** The step in words, with the numbers written in. */
  text: string;
  /** The same numbers, unrounded. */
  values: Record<string, number>;
}

/**
 * Every constant of the scoring model, in one place, each with where it comes from.
 *
 * Changing a number here changes every verdict the app shows, so each one names its source:
 * a published handbook or paper, or "our model, docs/scoring.md" where the number is a choice this
 * product made and documents in docs/scoring.md.
 *
 * @example
 * import { CERTAINTY_WEIGHT, LIKELIHOOD_RATIO_PER_APPRAISAL } from '@/lib/scoring/constants';
 * CERTAINTY_WEIGHT.high; // 1
 * LIKELIHOOD_RATIO_PER_APPRAISAL; // 4
 *
 * @module
 */

// ---------------------------------------------------------------------------------------------
// §1 Certainty of one appraisal
// ---------------------------------------------------------------------------------------------

/**
 * Study designs the appraisal form offers, in the order the form lists them.
 * Source: our model, docs/scoring.md §1 (design names after the GRADE Handbook, 2013).
 *
 * @example
 * STUDY_DESIGNS.includes('randomized'); // true
 */
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

/**
 * Starting certainty score per design (4 high … 1 very low).
 *
 * Source: GRADE Handbook (Schünemann et al., eds., 2013) — randomized evidence starts high,
 * observational evidence starts low. Case series, case reports and expert opinion at 1 and the
 * treatment of animal and in-vitro work (start 4, indirectness forced to very serious) are
 * our model, docs/scoring.md §1.
 *
 * @example
 * DESIGN_START_SCORE.cohort; // 2
 */
export const DESIGN_START_SCORE = {
  'meta-analysis': 4,
  randomized: 4,
  'non-randomized': 2,
  cohort: 2,
  'case-control': 2,
  'cross-sectional': 2,
  'case-series': 1,
  'case-report': 1,
  'expert-opinion': 1,
  animal: 4,
  'in-vitro': 4,
} as const satisfies Record<(typeof STUDY_DESIGNS)[number], 1 | 2 | 3 | 4>;

/**
 * Designs whose indirectness counts as at least very serious: a rat tendon or a cell culture
 * speaks to a climber's finger only through a chain of assumptions.
 * Source: our model, docs/scoring.md §1.
 *
 * @example
 * FORCED_INDIRECT_DESIGNS.includes('animal'); // true
 */
export const FORCED_INDIRECT_DESIGNS = ['animal', 'in-vitro'] as const;

// The downgrade domains, their concern levels and what each level changes live with their labels
// in ./appraisal-vocabulary.ts, the one source of the appraisal's vocabulary.
export { CONCERN_LEVELS, DOWNGRADE_DOMAINS } from './appraisal-vocabulary';

/**
 * Upgrading applies only to evidence that starts at this score or lower.
 * Source: GRADE Handbook (2013) says upgrading is mainly for observational evidence; the
 * exact cut at 2 is our model, docs/scoring.md §1.
 *
 * @example
 * UPGRADE_MAX_START; // 2
 */
export const UPGRADE_MAX_START = 2;

/**
 * Risk-ratio thresholds for a large (+1) and a very large (+2) effect.
 * Source: GRADE Handbook (2013); Guyatt et al. 2011, J Clin Epidemiol 64 (GRADE guidelines
 * series, rating up) — RR > 2 or < 0.5 large, RR > 5 or < 0.2 very large.
 *
 * @example
 * LARGE_EFFECT_RR.veryLargeAbove; // 5
 */
export const LARGE_EFFECT_RR = {
  largeAbove: 2,
  largeBelow: 0.5,
  veryLargeAbove: 5,
  veryLargeBelow: 0.2,
} as const;

/**
 * Lowest and highest certainty score. Source: GRADE Handbook (2013) — four levels.
 *
 * @example
 * CERTAINTY_SCORE_RANGE; // { min: 1, max: 4 }
 */
export const CERTAINTY_SCORE_RANGE = { min: 1, max: 4 } as const;

/**
 * Certainty level names by score. Source: GRADE Handbook (2013): high, moderate, low,
 * very low (spelled with a hyphen here because it is a key).
 *
 * @example
 * CERTAINTY_LEVEL_BY_SCORE[3]; // 'moderate'
 */
export const CERTAINTY_LEVEL_BY_SCORE = {
  4: 'high',
  3: 'moderate',
  2: 'low',
  1: 'very-low',
} as const;

/**
 * Certainty levels, lowest first. Source: GRADE Handbook (2013) — very low, low, moderate, high.
 *
 * @example
 * CERTAINTY_LEVELS[0]; // 'very-low'
 */
export const CERTAINTY_LEVELS = ['very-low', 'low', 'moderate', 'high'] as const;

// ---------------------------------------------------------------------------------------------
// §2 Applicability
// ---------------------------------------------------------------------------------------------

/**
 * Training status, least trained first; the distance between two positions is the number of
 * levels apart. Source: our model, docs/scoring.md §2.
 *
 * @example
 * TRAINING_STATUSES.indexOf('elite'); // 3
 */
export const TRAINING_STATUSES = ['untrained', 'recreational', 'trained', 'elite'] as const;

/**
 * populationMatch by levels apart (index 0 = same level, 1 = one apart, 2+ = further).
 * Source: our model, docs/scoring.md §2.
 *
 * @example
 * POPULATION_MATCH_BY_DISTANCE[1]; // 0.75
 */
export const POPULATION_MATCH_BY_DISTANCE = [1.0, 0.75, 0.5] as const;

/**
 * Extra levels of distance when one side is injured and the other healthy.
 * Source: our model, docs/scoring.md §2.
 *
 * @example
 * INJURY_EXTRA_LEVELS; // 1
 */
export const INJURY_EXTRA_LEVELS = 1;

/**
 * doseMatch never falls below this, so a study at a very different dose still counts a little.
 * Source: our model, docs/scoring.md §2.
 *
 * @example
 * DOSE_MATCH_FLOOR; // 0.1
 */
export const DOSE_MATCH_FLOOR = 0.1;

// ---------------------------------------------------------------------------------------------
// §3 Mechanism probability
// ---------------------------------------------------------------------------------------------

/**
 * Prior plausibility when the coach gives none. Source: our model, docs/scoring.md §3.
 *
 * @example
 * DEFAULT_PRIOR; // 0.5
 */
export const DEFAULT_PRIOR = 0.5;

/**
 * A prior is clamped into this range so that no opinion is beyond the reach of evidence.
 * Source: our model, docs/scoring.md §3.
 *
 * @example
 * PRIOR_CLAMP.max; // 0.99
 */
export const PRIOR_CLAMP = { min: 0.01, max: 0.99 } as const;

/**
 * Direction of an appraisal as the sign of its log-odds term. Source: our model, docs/scoring.md §3.
 *
 * @example
 * DIRECTION_SIGN.against; // -1
 */
export const DIRECTION_SIGN = { supports: 1, against: -1, neutral: 0 } as const;

/**
 * Weight of an appraisal by its certainty. Source: our model, docs/scoring.md §3 (the ordering follows
 * the GRADE levels; the numbers are ours).
 *
 * @example
 * CERTAINTY_WEIGHT.moderate; // 0.6
 */
export const CERTAINTY_WEIGHT = { high: 1.0, moderate: 0.6, low: 0.3, 'very-low': 0.1 } as const;

/**
 * Odds multiplier of one fully applicable, high-certainty appraisal; its log is the unit of
 * evidence. Source: our model, docs/scoring.md §3.
 *
 * @example
 * Math.log(LIKELIHOOD_RATIO_PER_APPRAISAL); // 1.3863
 */
export const LIKELIHOOD_RATIO_PER_APPRAISAL = 4;

/**
 * Odds divisor for a whole missing dose (shortfall 1): ln(20) per unit of shortfall.
 * Source: our model, docs/scoring.md §3.
 *
 * @example
 * Math.log(DOSE_PENALTY_ODDS); // 2.9957
 */
export const DOSE_PENALTY_ODDS = 20;

/**
 * Effort levels in order, with their position on the 0…3 effort scale.
 * Source: our model, docs/scoring.md §3.
 *
 * @example
 * EFFORT_SCALE.hard; // 2
 */
export const EFFORT_SCALE = { easy: 0, moderate: 1, hard: 2, 'to-failure': 3 } as const;

/**
 * Span of the effort scale; an effort shortfall is divided by it. Source: our model, docs/scoring.md §3.
 *
 * @example
 * EFFORT_SPAN; // 3
 */
export const EFFORT_SPAN = 3;

/**
 * Expected effect size of a mechanism, as a standardized mean difference.
 * Source: Cohen J. (1988), Statistical Power Analysis for the Behavioral Sciences, 2nd ed. —
 * small 0.2, medium 0.5, large 0.8 ("moderate" here is Cohen's "medium"); none 0 is ours.
 *
 * @example
 * MAGNITUDE_VALUE.large; // 0.8
 */
export const MAGNITUDE_VALUE = { none: 0, small: 0.2, moderate: 0.5, large: 0.8 } as const;

/**
 * Magnitude assumed when a mechanism states none. Source: our model, docs/scoring.md.
 *
 * @example
 * DEFAULT_MAGNITUDE; // 'moderate'
 */
export const DEFAULT_MAGNITUDE = 'moderate';

/**
 * Numerical guard: the closest a double can come to 0 or 1 while staying strictly inside, so a
 * probability is always in (0, 1) however much evidence piles up. 2^-53 is the gap just below 1;
 * it changes no probability a person would read. Source: our model (IEEE 754 double precision).
 *
 * @example
 * 1 - PROBABILITY_GUARD < 1; // true
 */
export const PROBABILITY_GUARD = 2 ** -53;

// ---------------------------------------------------------------------------------------------
// §4 Calibrated likelihood language
// ---------------------------------------------------------------------------------------------

/**
 * Likelihood terms and their lower edges, lowest band first; a band runs from its edge up to the
 * next band's edge, excluded, and the top band includes 1.
 * Source: IPCC Fourth Assessment Report, Working Group II, likelihood scale (2007); Mastrandrea
 * et al. (2010), Guidance Note for Lead Authors of the IPCC AR5 on Consistent Treatment of
 * Uncertainties. "0.99 is virtually certain" (the IPCC says "> 99 %") is our model, docs/scoring.md §4.
 *
 * @example
 * LIKELIHOOD_SCALE[6]; // { term: 'virtually certain', min: 0.99 }
 */
export const LIKELIHOOD_SCALE = [
  { term: 'exceptionally unlikely', min: 0 },
  { term: 'very unlikely', min: 0.01 },
  { term: 'unlikely', min: 0.1 },
  { term: 'about as likely as not', min: 0.33 },
  { term: 'likely', min: 0.66 },
  { term: 'very likely', min: 0.9 },
  { term: 'virtually certain', min: 0.99 },
] as const;

// ---------------------------------------------------------------------------------------------
// §5 Verdict
// ---------------------------------------------------------------------------------------------

/**
 * Below this evidence weight W the review has too little evidence for any verdict.
 * Source: our model, docs/scoring.md §5 — one fully applicable high-certainty appraisal is W = 1.
 *
 * @example
 * MIN_EVIDENCE_WEIGHT; // 1
 */
export const MIN_EVIDENCE_WEIGHT = 1.0;

/**
 * Probability cut-offs of the verdict table; they sit on the edges of the likelihood scale so
 * the verdict and the words always agree. Source: our model, docs/scoring.md §5.
 *
 * @example
 * VERDICT_THRESHOLDS.holds; // 0.66
 */
export const VERDICT_THRESHOLDS = { notSupportedBelow: 0.33, uncertainBelow: 0.66, holds: 0.66 } as const;

/**
 * Verdict keys in the order the table of docs/scoring.md §5 tests them. Source: our model, docs/scoring.md §5.
 *
 * @example
 * VERDICT_KEYS[0]; // 'insufficient'
 */
export const VERDICT_KEYS = ['insufficient', 'not-supported', 'uncertain', 'supported', 'other-reasons'] as const;

/**
 * The words a reader sees for each verdict. Source: our model, docs/scoring.md §5.
 *
 * @example
 * VERDICT_LABEL.supported; // 'Holds up'
 */
export const VERDICT_LABEL = {
  insufficient: 'Not enough evidence',
  'not-supported': 'Does not hold up',
  uncertain: 'Unsettled',
  supported: 'Holds up',
  'other-reasons': 'Works, but not for the stated reason',
} as const satisfies Record<(typeof VERDICT_KEYS)[number], string>;

// ---------------------------------------------------------------------------------------------
// §6 Effect sizes and meta-analysis
// ---------------------------------------------------------------------------------------------

/**
 * Added to every cell of a 2×2 table that has a zero cell, so logs and reciprocals exist.
 * Source: common practice (the Haldane–Anscombe correction); docs/scoring.md.
 *
 * @example
 * CONTINUITY_CORRECTION; // 0.5
 */
export const CONTINUITY_CORRECTION = 0.5;

/**
 * Factor from a log odds ratio to Cohen's d: √3 / π (logistic distribution's SD).
 * Source: Borenstein et al. (2009), Introduction to Meta-Analysis, ch. 7.
 *
 * @example
 * LOG_OR_TO_D; // 0.5513
 */
export const LOG_OR_TO_D = Math.sqrt(3) / Math.PI;

/**
 * Confidence level used when none is given. Source: common practice (95 %).
 *
 * @example
 * DEFAULT_CONFIDENCE_LEVEL; // 0.95
 */
export const DEFAULT_CONFIDENCE_LEVEL = 0.95;

/**
 * Fisher-scoring limits for REML τ²: stop when a step changes τ² by less than the tolerance.
 * Source: our model — a tight tolerance because each step is cheap (O(k)).
 *
 * @example
 * REML_CONTROL.tolerance; // 1e-12
 */
export const REML_CONTROL = { tolerance: 1e-12, maxIterations: 1000 } as const;

/**
 * Smallest number of studies for a prediction interval (t with k − 2 df needs k ≥ 3).
 * Source: docs/scoring.md §6 and precise rules (the interval is after Higgins, Thompson &
 * Spiegelhalter 2009 — citation from memory).
 *
 * @example
 * PREDICTION_INTERVAL_MIN_K; // 3
 */
export const PREDICTION_INTERVAL_MIN_K = 3;

// ---------------------------------------------------------------------------------------------
// §7 Agreement between reviewers
// ---------------------------------------------------------------------------------------------

/**
 * Krippendorff's alpha cut-offs: ≥ 0.800 reliable, ≥ 0.667 tentative, below that unreliable.
 * Source: Krippendorff K. (2011), Computing Krippendorff's Alpha-Reliability, Annenberg School
 * for Communication departmental paper 43.
 *
 * @example
 * ALPHA_THRESHOLDS.reliable; // 0.8
 */
export const ALPHA_THRESHOLDS = { reliable: 0.8, tentative: 0.667 } as const;

/**
 * Upper edges of the kappa bands (each edge included in its band); below 0 is poor, above 0.80
 * almost perfect. Source: Landis J.R. & Koch G.G. (1977), Biometrics 33:159–174.
 *
 * @example
 * KAPPA_BANDS[0]; // { label: 'slight', max: 0.2 }
 */
export const KAPPA_BANDS = [
  { label: 'slight', max: 0.2 },
  { label: 'fair', max: 0.4 },
  { label: 'moderate', max: 0.6 },
  { label: 'substantial', max: 0.8 },
] as const;

/**
 * Reviewers whose ratings of one mechanism span this many likelihood bands or more disagree
 * enough to talk. Source: our model, docs/scoring.md §7.
 *
 * @example
 * DEFAULT_SPREAD_FLAG; // 2
 */
export const DEFAULT_SPREAD_FLAG = 2;

// ---------------------------------------------------------------------------------------------
// §8 Dose helpers
// ---------------------------------------------------------------------------------------------

/**
 * Epley's one-repetition-maximum formula: 1RM = w · (1 + r / 30).
 * Source: Epley, B. (1985), Poundage chart, Boyd Epley Workout (from memory); docs/scoring.md §8.
 *
 * @example
 * EPLEY_DIVISOR; // 30
 */
export const EPLEY_DIVISOR = 30;

/**
 * Brzycki's formula: 1RM = w · 36 / (37 − r).
 * Source: Brzycki M. (1993), JOPERD.
 *
 * @example
 * BRZYCKI; // { numerator: 36, offset: 37 }
 */
export const BRZYCKI = { numerator: 36, offset: 37 } as const;

/**
 * Repetition range over which the 1RM formulas are used; beyond about 10–12 reps both drift.
 * Source: common practice; the cut at 12 is our model, docs/scoring.md.
 *
 * @example
 * ONE_REP_MAX_REPS.max; // 12
 */
export const ONE_REP_MAX_REPS = { min: 1, max: 12 } as const;

/**
 * Waking hours available for spacing sessions within a day, unless the protocol says otherwise.
 * Source: common practice (8 hours of sleep); docs/scoring.md.
 *
 * @example
 * DEFAULT_WAKING_HOURS; // 16
 */
export const DEFAULT_WAKING_HOURS = 16;

/**
 * Training days in a week when the protocol does not say. Source: our model, docs/scoring.md.
 *
 * @example
 * DEFAULT_DAYS_PER_WEEK; // 7
 */
export const DEFAULT_DAYS_PER_WEEK = 7;

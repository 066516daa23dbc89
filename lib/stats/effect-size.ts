import { CONTINUITY_CORRECTION, DEFAULT_CONFIDENCE_LEVEL, LOG_OR_TO_D } from '../scoring/constants';
import { ScoringInputError } from '../scoring/errors';
import { requireFinite, requireInteger, requireObject } from '../scoring/validate';
import { normalQuantile } from './distributions';

/**
 * A standardized mean difference with Hedges' small-sample correction (Borenstein et al. 2009,
 * Introduction to Meta-Analysis, ch. 4).
 *
 * @example
 * const smd: StandardizedMeanDifference = { d: 0.597, vd: 0.0418, J: 0.9923, g: 0.5924, vg: 0.0411, df: 98 };
 */
export interface StandardizedMeanDifference {
  /** Cohen's d. */
  d: number;
  /** Variance of d. */
  vd: number;
  /** Hedges' correction factor J = 1 − 3 / (4·df − 1). */
  J: number;
  /** Hedges' g = J·d. */
  g: number;
  /** Variance of g = J²·V_d. */
  vg: number;
  /** Degrees of freedom n1 + n2 − 2. */
  df: number;
}

/**
 * An effect on the log scale with its sampling variance, ready for {@link metaAnalysis}.
 *
 * @example
 * const effect: EffectEstimate = { yi: -0.9387, vi: 0.3571 };
 */
export interface EffectEstimate {
  yi: number;
  vi: number;
}

/**
 * A 2×2 table: a, b = events and non-events in the treated (or exposed) group; c, d = the same
 * in the control group.
 *
 * @example
 * const table: TwoByTwo = { a: 4, b: 119, c: 11, d: 128 };
 */
export interface TwoByTwo {
  a: number;
  b: number;
  c: number;
  d: number;
}

function finishSmd(d: number, n1: number, n2: number): StandardizedMeanDifference {
  const df = n1 + n2 - 2;
  const vd = (n1 + n2) / (n1 * n2) + (d * d) / (2 * (n1 + n2));
  const J = 1 - 3 / (4 * df - 1);
  return { d, vd, J, g: J * d, vg: J * J * vd, df };
}

function requireGroupSize(field: string, n: unknown): number {
  return requireInteger(field, n, { min: 2 });
}

/**
 * Cohen's d and Hedges' g from two groups' means, SDs and sizes (Borenstein et al. 2009, ch. 4):
 * S_within = √(((n1−1)·sd1² + (n2−1)·sd2²) / (n1+n2−2)), d = (m1 − m2) / S_within,
 * V_d = (n1+n2)/(n1·n2) + d²/(2(n1+n2)), J = 1 − 3/(4·df − 1), g = J·d, V_g = J²·V_d.
 * Also returns S_within, which the book prints as a check.
 *
 * @example
 * smdFromMeans({ m1: 103, sd1: 5.5, n1: 50, m2: 100, sd2: 4.5, n2: 50 });
 * // { d: 0.5970, vd: 0.0418, J: 0.9923, g: 0.5924, vg: 0.0411, df: 98, sWithin: 5.0249 }
 */
export function smdFromMeans(input: {
  m1: number;
  sd1: number;
  n1: number;
  m2: number;
  sd2: number;
  n2: number;
}): StandardizedMeanDifference & { sWithin: number } {
  const raw = requireObject('smd input', input);
  const m1 = requireFinite('m1', raw.m1);
  const m2 = requireFinite('m2', raw.m2);
  const sd1 = requireFinite('sd1', raw.sd1, { min: 0 });
  const sd2 = requireFinite('sd2', raw.sd2, { min: 0 });
  const n1 = requireGroupSize('n1', raw.n1);
  const n2 = requireGroupSize('n2', raw.n2);
  const sWithin = Math.sqrt(((n1 - 1) * sd1 * sd1 + (n2 - 1) * sd2 * sd2) / (n1 + n2 - 2));
  if (sWithin === 0) {
    throw new ScoringInputError('sd1', 'both standard deviations are 0, so no standardized difference exists');
  }
  return { ...finishSmd((m1 - m2) / sWithin, n1, n2), sWithin };
}

/**
 * Cohen's d (and g) from an independent-samples t statistic: d = t·√(1/n1 + 1/n2)
 * (Borenstein et al. 2009, ch. 7), for studies that report only the test.
 *
 * @example
 * smdFromT({ t: 2.5, n1: 20, n2: 20 }).d; // 0.7906
 */
export function smdFromT(input: { t: number; n1: number; n2: number }): StandardizedMeanDifference {
  const raw = requireObject('smd input', input);
  const t = requireFinite('t', raw.t);
  const n1 = requireGroupSize('n1', raw.n1);
  const n2 = requireGroupSize('n2', raw.n2);
  return finishSmd(t * Math.sqrt(1 / n1 + 1 / n2), n1, n2);
}

function readTable(input: TwoByTwo): { a: number; b: number; c: number; d: number; corrected: boolean } {
  const raw = requireObject('2×2 table', input);
  const cells = (['a', 'b', 'c', 'd'] as const).map((k) => requireFinite(k, raw[k], { min: 0 }));
  const corrected = cells.some((x) => x === 0);
  const [a, b, c, d] = corrected ? cells.map((x) => x + CONTINUITY_CORRECTION) : cells;
  return { a, b, c, d, corrected };
}

/**
 * Log risk ratio of a 2×2 table and its variance: yi = ln((a/(a+b)) / (c/(c+d))),
 * vi = 1/a − 1/(a+b) + 1/c − 1/(c+d). A zero cell adds 0.5 to every cell first.
 *
 * @example
 * logRiskRatio({ a: 4, b: 119, c: 11, d: 128 }); // { yi: −0.8893, vi: 0.3256, corrected: false }
 */
export function logRiskRatio(input: TwoByTwo): EffectEstimate & { corrected: boolean } {
  const { a, b, c, d, corrected } = readTable(input);
  return {
    yi: Math.log(a / (a + b) / (c / (c + d))),
    vi: 1 / a - 1 / (a + b) + 1 / c - 1 / (c + d),
    corrected,
  };
}

/**
 * Log odds ratio of a 2×2 table and its variance: yi = ln(a·d / (b·c)),
 * vi = 1/a + 1/b + 1/c + 1/d. A zero cell adds 0.5 to every cell first.
 *
 * @example
 * logOddsRatio({ a: 4, b: 119, c: 11, d: 128 }); // { yi: −0.9387, vi: 0.3571, corrected: false }
 */
export function logOddsRatio(input: TwoByTwo): EffectEstimate & { corrected: boolean } {
  const { a, b, c, d, corrected } = readTable(input);
  return { yi: Math.log((a * d) / (b * c)), vi: 1 / a + 1 / b + 1 / c + 1 / d, corrected };
}

/**
 * A log odds ratio on Cohen's d scale: d = ln(OR)·√3/π, V_d = V·3/π² (Borenstein et al. 2009,
 * ch. 7), so binary and continuous outcomes can be pooled together.
 *
 * @example
 * logOddsRatioToD(Math.log(3), 0.2); // { d: 0.6057, vd: 0.0608 }
 * logOddsRatioToD(Math.log(3)).vd; // undefined
 */
export function logOddsRatioToD(yi: number, vi?: number): { d: number; vd?: number } {
  requireFinite('yi', yi);
  if (vi === undefined) return { d: yi * LOG_OR_TO_D };
  requireFinite('vi', vi, { min: 0 });
  return { d: yi * LOG_OR_TO_D, vd: vi * LOG_OR_TO_D * LOG_OR_TO_D };
}

/**
 * Standard error from a symmetric confidence interval: (hi − lo) / (2·z), z the normal quantile
 * of the level. For ratios pass the logs of the limits — the interval is symmetric only there.
 *
 * @example
 * seFromCI(-0.5097, -0.3509); // 0.0405
 * seFromCI(Math.log(0.6), Math.log(0.9)); // 0.1034
 */
export function seFromCI(lo: number, hi: number, level = DEFAULT_CONFIDENCE_LEVEL): number {
  requireFinite('lo', lo);
  requireFinite('hi', hi);
  requireFinite('level', level, { min: 0, max: 1, minExclusive: true, maxExclusive: true });
  if (!(hi > lo)) throw new ScoringInputError('hi', `must be above lo (${lo}), got ${hi}`);
  return (hi - lo) / (2 * normalQuantile((1 + level) / 2));
}

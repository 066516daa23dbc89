import jStat from 'jstat';
import { requireFinite } from '../scoring/validate';

/**
 * Distribution functions for the statistics module, all from jstat (a well-tested registry
 * package) rather than hand-written series, behind names that say which tail they return.
 *
 * @example
 * normalQuantile(0.975); // 1.959964
 *
 * @module
 */

/**
 * Standard normal quantile z with Φ(z) = p.
 *
 * @example
 * normalQuantile(0.975); // 1.959964
 */
export function normalQuantile(p: number): number {
  requireFinite('p', p, { min: 0, max: 1, minExclusive: true, maxExclusive: true });
  return jStat.normal.inv(p, 0, 1);
}

/**
 * Two-sided p-value of a z statistic, 2·Φ(−|z|). Computed from the lower tail so that small
 * p-values keep their digits instead of cancelling in 1 − Φ. jstat's tail loses relative
 * accuracy below about 1e-15 and reaches 0 near |z| = 8.3: read such a p as "p < 1e-15".
 *
 * @example
 * normalTwoSidedP(1.959964); // 0.05
 */
export function normalTwoSidedP(z: number): number {
  requireFinite('z', z);
  return Math.min(1, 2 * jStat.normal.cdf(-Math.abs(z), 0, 1));
}

/**
 * Upper tail P(X ≥ x) of a chi-square distribution. jstat's tail underflows to 0 below about
 * 1e-16, which is read as "p < 1e-16".
 *
 * @example
 * chiSquareUpperTail(3.841459, 1); // 0.05
 */
export function chiSquareUpperTail(x: number, df: number): number {
  requireFinite('x', x, { min: 0 });
  requireFinite('df', df, { min: 0, minExclusive: true });
  return Math.max(0, 1 - jStat.chisquare.cdf(x, df));
}

/**
 * Student t quantile with `df` degrees of freedom.
 *
 * @example
 * studentTQuantile(0.975, 11); // 2.200985
 */
export function studentTQuantile(p: number, df: number): number {
  requireFinite('p', p, { min: 0, max: 1, minExclusive: true, maxExclusive: true });
  requireFinite('df', df, { min: 0, minExclusive: true });
  return jStat.studentt.inv(p, df);
}

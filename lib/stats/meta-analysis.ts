import { DEFAULT_CONFIDENCE_LEVEL, PREDICTION_INTERVAL_MIN_K, REML_CONTROL } from '../scoring/constants';
import { ScoringInputError } from '../scoring/errors';
import { requireArray, requireFinite, requireObject, requireOneOf } from '../scoring/validate';
import { chiSquareUpperTail, normalQuantile, normalTwoSidedP, studentTQuantile } from './distributions';
import type { EffectEstimate } from './effect-size';

/**
 * Pooling methods: inverse-variance fixed effect, DerSimonian–Laird random effects, and
 * restricted maximum likelihood random effects.
 *
 * @example
 * const method: PoolingMethod = 'REML';
 */
export type PoolingMethod = 'fixed' | 'DL' | 'REML';

const METHODS = ['fixed', 'DL', 'REML'] as const;

/**
 * Options of {@link metaAnalysis}.
 *
 * @example
 * const options: MetaAnalysisOptions = { method: 'REML', level: 0.9 };
 */
export interface MetaAnalysisOptions {
  /** Default 'DL'. */
  method?: PoolingMethod;
  /** Confidence level for the CI and the prediction interval, 0…1; default 0.95. */
  level?: number;
}

/**
 * A pooled effect with its heterogeneity statistics and per-study weights (for the forest plot).
 * `pQ`, `H2` and `predictionInterval` are absent where they are undefined: for one study, and the
 * interval also for fixed-effect models and for k < 3.
 *
 * @example
 * const result: MetaAnalysisResult = metaAnalysis([{ yi: 0.4, vi: 0.04 }]);
 * result.estimate; // 0.4
 */
export interface MetaAnalysisResult {
  k: number;
  method: PoolingMethod;
  estimate: number;
  se: number;
  ci: [number, number];
  z: number;
  p: number;
  /** Cochran's Q from the fixed-effect weights (the same for every method). */
  Q: number;
  df: number;
  pQ?: number;
  tau2: number;
  /** Percentage 0…100: max(0, (Q − df)/Q)·100. */
  I2: number;
  /** Q / df. */
  H2?: number;
  /** Percentages of the total weight, in input order; they sum to 100. */
  weights: number[];
  predictionInterval?: [number, number];
  /** Fisher-scoring iterations REML needed (REML only). */
  iterations?: number;
}

function readStudies(studies: unknown): { y: Float64Array; v: Float64Array } {
  const list = requireArray<unknown>('studies', studies);
  if (list.length === 0) throw new ScoringInputError('studies', 'needs at least one study');
  const y = new Float64Array(list.length);
  const v = new Float64Array(list.length);
  for (let i = 0; i < list.length; i += 1) {
    const study = requireObject(`studies[${i}]`, list[i]);
    y[i] = requireFinite(`studies[${i}].yi`, study.yi);
    v[i] = requireFinite(`studies[${i}].vi`, study.vi, { min: 0, minExclusive: true });
  }
  return { y, v };
}

/** Weighted mean and total weight for weights 1 / (v + tau2). */
function pool(y: Float64Array, v: Float64Array, tau2: number): { mu: number; sw: number; w: Float64Array } {
  const w = new Float64Array(y.length);
  let sw = 0;
  let swy = 0;
  for (let i = 0; i < y.length; i += 1) {
    const wi = 1 / (v[i] + tau2);
    w[i] = wi;
    sw += wi;
    swy += wi * y[i];
  }
  return { mu: swy / sw, sw, w };
}

/**
 * REML τ² by Fisher scoring, started at the DerSimonian–Laird value. For the intercept-only
 * model the score and information reduce to sums over studies:
 * τ² ← τ² + (Σ w²(y − μ)² − tr P) / tr(P²), with tr P = Σw − Σw²/Σw and
 * tr(P²) = Σw² − 2Σw³/Σw + (Σw²)²/(Σw)², w = 1/(v + τ²); τ² is kept ≥ 0.
 *
 * Step halving: near a τ² close to zero the expected information can underestimate the curvature,
 * and the plain steps overshoot back and forth around the solution, each undoing ~99 % of the
 * last (seen on nine studies with τ² ≈ 5e-8: still oscillating after 1,000 steps in one order of
 * the studies, converged in the other). A step that reverses the previous one is therefore taken
 * at half length. The fixed point — where the score is zero — is the same; only the way to it is
 * damped.
 */
function remlTau2(y: Float64Array, v: Float64Array, start: number): { tau2: number; iterations: number } {
  let tau2 = start;
  let previousStep = 0;
  for (let iteration = 1; iteration <= REML_CONTROL.maxIterations; iteration += 1) {
    let sw = 0;
    let sw2 = 0;
    let sw3 = 0;
    let swy = 0;
    for (let i = 0; i < y.length; i += 1) {
      const w = 1 / (v[i] + tau2);
      sw += w;
      sw2 += w * w;
      sw3 += w * w * w;
      swy += w * y[i];
    }
    const mu = swy / sw;
    let yPPy = 0;
    for (let i = 0; i < y.length; i += 1) {
      const w = 1 / (v[i] + tau2);
      const r = y[i] - mu;
      yPPy += w * w * r * r;
    }
    const trP = sw - sw2 / sw;
    const trPP = sw2 - (2 * sw3) / sw + (sw2 * sw2) / (sw * sw);
    let step = (yPPy - trP) / trPP;
    if (step * previousStep < 0) step /= 2;
    previousStep = step;
    const next = Math.max(0, tau2 + step);
    if (Math.abs(next - tau2) <= REML_CONTROL.tolerance * Math.max(1, tau2)) {
      return { tau2: next, iterations: iteration };
    }
    tau2 = next;
  }
  throw new ScoringInputError(
    'studies',
    `REML did not converge in ${REML_CONTROL.maxIterations} iterations; use method 'DL' for these studies`,
  );
}

/**
 * Inverse-variance meta-analysis of effect sizes (docs/scoring.md §6): fixed effect, or random effects
 * with τ² from DerSimonian–Laird (default) or REML. Returns the pooled estimate, SE, CI, z and p,
 * Cochran's Q with df and p(Q), τ², I² = max(0, (Q − df)/Q)·100 and H² = Q/df (Higgins &
 * Thompson 2002; the same formulas for every method), per-study weights in percent, and for random
 * effects with k ≥ 3 the prediction interval μ ± t(k−2)·√(SE² + τ²).
 *
 * One study is not pooled: it is returned as it is (estimate yi, se √vi, Q 0, df 0, τ² 0, I² 0,
 * weight 100 %), without p(Q), H² or a prediction interval.
 *
 * @example
 * metaAnalysis([
 *   { yi: -0.8893, vi: 0.3256 },
 *   { yi: -1.5854, vi: 0.1946 },
 *   { yi: -1.3481, vi: 0.4154 },
 * ]);
 * // { k: 3, method: 'DL', estimate: …, ci: […], Q: …, tau2: …, weights: [..], predictionInterval: [..] }
 */
export function metaAnalysis(
  studies: readonly EffectEstimate[],
  options: MetaAnalysisOptions = {},
): MetaAnalysisResult {
  const opts = requireObject('options', options);
  const method: PoolingMethod = opts.method === undefined ? 'DL' : requireOneOf('options.method', opts.method, METHODS);
  const level =
    opts.level === undefined
      ? DEFAULT_CONFIDENCE_LEVEL
      : requireFinite('options.level', opts.level, { min: 0, max: 1, minExclusive: true, maxExclusive: true });
  const { y, v } = readStudies(studies);
  const k = y.length;
  const zCrit = normalQuantile((1 + level) / 2);

  if (k === 1) {
    const se = Math.sqrt(v[0]);
    const z = y[0] / se;
    return {
      k,
      method,
      estimate: y[0],
      se,
      ci: [y[0] - zCrit * se, y[0] + zCrit * se],
      z,
      p: normalTwoSidedP(z),
      Q: 0,
      df: 0,
      tau2: 0,
      I2: 0,
      weights: [100],
    };
  }

  // Fixed-effect pass: Q and the DL moment estimate both come from it.
  const fixed = pool(y, v, 0);
  let Q = 0;
  let sw2 = 0;
  for (let i = 0; i < k; i += 1) {
    const r = y[i] - fixed.mu;
    Q += fixed.w[i] * r * r;
    sw2 += fixed.w[i] * fixed.w[i];
  }
  const df = k - 1;
  const dlTau2 = Math.max(0, (Q - df) / (fixed.sw - sw2 / fixed.sw));

  let tau2 = 0;
  let iterations: number | undefined;
  if (method === 'DL') tau2 = dlTau2;
  if (method === 'REML') ({ tau2, iterations } = remlTau2(y, v, dlTau2));

  const pooled = method === 'fixed' ? fixed : pool(y, v, tau2);
  const se = Math.sqrt(1 / pooled.sw);
  const estimate = pooled.mu;
  const z = estimate / se;
  const weights = Array.from(pooled.w, (w) => (100 * w) / pooled.sw);

  const result: MetaAnalysisResult = {
    k,
    method,
    estimate,
    se,
    ci: [estimate - zCrit * se, estimate + zCrit * se],
    z,
    p: normalTwoSidedP(z),
    Q,
    df,
    pQ: chiSquareUpperTail(Q, df),
    tau2,
    I2: Q > 0 ? Math.max(0, (Q - df) / Q) * 100 : 0,
    H2: Q / df,
    weights,
  };
  if (iterations !== undefined) result.iterations = iterations;
  if (method !== 'fixed' && k >= PREDICTION_INTERVAL_MIN_K) {
    const half = studentTQuantile((1 + level) / 2, k - 2) * Math.sqrt(se * se + tau2);
    result.predictionInterval = [estimate - half, estimate + half];
  }
  return result;
}

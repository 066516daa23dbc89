import { ALPHA_THRESHOLDS, DEFAULT_SPREAD_FLAG, KAPPA_BANDS } from '../scoring/constants';
import { ScoringInputError } from '../scoring/errors';
import { requireArray, requireFinite, requireInteger, requireObject, requireOneOf } from '../scoring/validate';

/**
 * A reviewer's rating: a likelihood band 0…6 in the app, or any number or label; `null` (or
 * `undefined`) is a rating the reviewer did not give.
 *
 * @example
 * const ratings: Rating[] = [4, null, 5];
 */
export type Rating = number | string | null | undefined;

/**
 * Rows are raters, columns are units (mechanisms), `null` is missing.
 *
 * @example
 * const matrix: RatingMatrix = [
 *   [4, 5, null],
 *   [4, 3, 2],
 * ];
 */
export type RatingMatrix = readonly (readonly (number | null | undefined)[])[];

/**
 * Distance metric of Krippendorff's alpha.
 *
 * @example
 * const metric: AlphaMetric = 'ordinal';
 */
export type AlphaMetric = 'nominal' | 'ordinal' | 'interval' | 'ratio';

const METRICS = ['nominal', 'ordinal', 'interval', 'ratio'] as const;

/**
 * Weighting of Cohen's kappa.
 *
 * @example
 * const weights: KappaWeights = 'quadratic';
 */
export type KappaWeights = 'none' | 'linear' | 'quadratic';

const WEIGHTINGS = ['none', 'linear', 'quadratic'] as const;

// ---------------------------------------------------------------------------------------------
// Krippendorff's alpha
// ---------------------------------------------------------------------------------------------

function readMatrix(matrix: unknown): { raters: number; units: number; rows: (number | null)[][] } {
  const list = requireArray<unknown>('ratings', matrix);
  if (list.length === 0) throw new ScoringInputError('ratings', 'needs at least one rater (row)');
  const rows = list.map((row, r) => requireArray<unknown>(`ratings[${r}]`, row));
  const units = rows[0].length;
  if (units === 0) throw new ScoringInputError('ratings[0]', 'needs at least one unit (column)');
  return {
    raters: rows.length,
    units,
    rows: rows.map((row, r) => {
      if (row.length !== units) {
        throw new ScoringInputError(`ratings[${r}]`, `has ${row.length} ratings where row 0 has ${units}`);
      }
      return row.map((value, u) =>
        value === null || value === undefined ? null : requireFinite(`ratings[${r}][${u}]`, value),
      );
    }),
  };
}

/**
 * The coincidence matrix of Krippendorff's alpha and what it is built from.
 *
 * @example
 * const c: CoincidenceMatrix = { values: [1, 2], matrix: [[2, 0], [0, 2]], totals: [2, 2], n: 4,
 *   unitsUsed: [0, 1], unitsDropped: [] };
 */
export interface CoincidenceMatrix {
  /** The distinct values rated, ascending; row and column i of `matrix` are values[i]. */
  values: number[];
  /** o_ck: pairs of values c, k within units, each unit weighted 1 / (m_u − 1). */
  matrix: number[][];
  /** n_c: row sums of the matrix. */
  totals: number[];
  /** n: the number of pairable values. */
  n: number;
  /** Units (column indices) with two or more ratings. */
  unitsUsed: number[];
  /** Units left out because they have fewer than two ratings. */
  unitsDropped: number[];
}

/**
 * Krippendorff's coincidence matrix: within each unit with m_u ≥ 2 ratings every ordered pair of
 * ratings from different raters adds 1 / (m_u − 1) to o_ck (Krippendorff 2011). Units with fewer
 * than two ratings carry no information about agreement and are dropped.
 *
 * @example
 * coincidenceMatrix([[1, 2], [1, 2]]);
 * // { values: [1, 2], matrix: [[2, 0], [0, 2]], totals: [2, 2], n: 4, unitsUsed: [0, 1], unitsDropped: [] }
 */
export function coincidenceMatrix(matrix: RatingMatrix): CoincidenceMatrix {
  const { raters, units, rows } = readMatrix(matrix);
  const valueSet = new Set<number>();
  for (const row of rows) for (const value of row) if (value !== null) valueSet.add(value);
  const values = [...valueSet].sort((a, b) => a - b);
  const index = new Map(values.map((value, i) => [value, i]));
  const V = values.length;
  const o = Array.from({ length: V }, () => new Array<number>(V).fill(0));
  const unitsUsed: number[] = [];
  const unitsDropped: number[] = [];
  const counts = new Array<number>(V).fill(0);
  for (let u = 0; u < units; u += 1) {
    counts.fill(0);
    let m = 0;
    for (let r = 0; r < raters; r += 1) {
      const value = rows[r][u];
      if (value !== null) {
        counts[index.get(value) as number] += 1;
        m += 1;
      }
    }
    if (m < 2) {
      unitsDropped.push(u);
      continue;
    }
    unitsUsed.push(u);
    for (let c = 0; c < V; c += 1) {
      if (counts[c] === 0) continue;
      for (let k = 0; k < V; k += 1) {
        if (counts[k] === 0) continue;
        const pairs = c === k ? counts[c] * (counts[c] - 1) : counts[c] * counts[k];
        o[c][k] += pairs / (m - 1);
      }
    }
  }
  const totals = o.map((row) => row.reduce((s, x) => s + x, 0));
  const n = totals.reduce((s, x) => s + x, 0);
  return { values, matrix: o, totals, n, unitsUsed, unitsDropped };
}

/**
 * Krippendorff's alpha with everything it is computed from.
 *
 * @example
 * const d: AlphaDetails = krippendorffAlphaDetails([[1, 2], [1, 2]]);
 * d.alpha; // 1
 */
export interface AlphaDetails extends CoincidenceMatrix {
  alpha: number;
  metric: AlphaMetric;
  /** D_o = Σ o_ck δ²_ck / n. */
  observedDisagreement: number;
  /** D_e = Σ n_c n_k δ²_ck / (n (n − 1)). */
  expectedDisagreement: number;
}

function squaredDistance(metric: AlphaMetric, values: number[], totals: number[]): (c: number, k: number) => number {
  switch (metric) {
    case 'nominal':
      return (c, k) => (c === k ? 0 : 1);
    case 'interval':
      return (c, k) => (values[c] - values[k]) ** 2;
    case 'ratio':
      return (c, k) => {
        const sum = values[c] + values[k];
        return sum === 0 ? 0 : ((values[c] - values[k]) / sum) ** 2;
      };
    case 'ordinal': {
      // δ²_ck = (Σ_{g=c..k} n_g − (n_c + n_k)/2)², on ranks of the values actually used.
      const cumulative = [0];
      for (const t of totals) cumulative.push(cumulative[cumulative.length - 1] + t);
      return (c, k) => {
        const lo = Math.min(c, k);
        const hi = Math.max(c, k);
        return (cumulative[hi + 1] - cumulative[lo] - (totals[lo] + totals[hi]) / 2) ** 2;
      };
    }
  }
}

/**
 * Krippendorff's alpha with its coincidence matrix and disagreements (Krippendorff 2011,
 * Computing Krippendorff's Alpha-Reliability): α = 1 − D_o / D_e. When every pairable rating is
 * the same value there is no variation to disagree about (D_e = 0) and α is 1.
 *
 * @example
 * krippendorffAlphaDetails([[1, 2, 3], [1, 2, 4]], { metric: 'interval' }).alpha; // 0.878
 */
export function krippendorffAlphaDetails(matrix: RatingMatrix, options: { metric?: AlphaMetric } = {}): AlphaDetails {
  const opts = requireObject('options', options);
  const metric: AlphaMetric =
    opts.metric === undefined ? 'ordinal' : requireOneOf('options.metric', opts.metric, METRICS);
  const coincidence = coincidenceMatrix(matrix);
  const { values, matrix: o, totals, n } = coincidence;
  if (n === 0) {
    throw new ScoringInputError('ratings', 'no unit has two or more ratings, so agreement cannot be measured');
  }
  if (metric === 'ratio' && values.some((v) => v < 0)) {
    throw new ScoringInputError('ratings', 'the ratio metric needs ratings of 0 or more');
  }
  const delta = squaredDistance(metric, values, totals);
  let observed = 0;
  let expected = 0;
  for (let c = 0; c < values.length; c += 1) {
    for (let k = 0; k < values.length; k += 1) {
      if (c === k) continue;
      const d2 = delta(c, k);
      observed += o[c][k] * d2;
      expected += totals[c] * totals[k] * d2;
    }
  }
  const observedDisagreement = observed / n;
  const expectedDisagreement = n > 1 ? expected / (n * (n - 1)) : 0;
  const alpha = expectedDisagreement === 0 ? 1 : 1 - observedDisagreement / expectedDisagreement;
  return { ...coincidence, alpha, metric, observedDisagreement, expectedDisagreement };
}

/**
 * Krippendorff's alpha for reviewers' ratings: rows are raters, columns units, `null` missing;
 * units with fewer than two ratings are dropped. The default metric is ordinal because the app's
 * ratings are likelihood bands 0…6. Nominal, interval and ratio are available too.
 *
 * @example
 * krippendorffAlpha([
 *   [1, 2, 3, 3, 2, 1, 4, 1, 2, null, null, null],
 *   [1, 2, 3, 3, 2, 2, 4, 1, 2, 5, null, 3],
 *   [null, 3, 3, 3, 2, 3, 4, 2, 2, 5, 1, null],
 *   [1, 2, 3, 3, 2, 4, 4, 1, 2, 5, 1, null],
 * ], { metric: 'nominal' }); // 0.743 (Krippendorff 2011)
 */
export function krippendorffAlpha(matrix: RatingMatrix, options: { metric?: AlphaMetric } = {}): number {
  return krippendorffAlphaDetails(matrix, options).alpha;
}

// ---------------------------------------------------------------------------------------------
// Cohen's kappa
// ---------------------------------------------------------------------------------------------

/**
 * Cohen's kappa with its agreement table and the weights used.
 *
 * @example
 * const d: KappaDetails = cohenKappaFromTable([[20, 5], [10, 15]]);
 * d.po; // 0.7
 */
export interface KappaDetails {
  kappa: number;
  /** Observed (weighted) agreement. */
  po: number;
  /** Agreement expected by chance from the two raters' margins. */
  pe: number;
  /** Number of rated pairs. */
  n: number;
  /** Counts: rows rater 1, columns rater 2, in category order. */
  table: number[][];
  /** Agreement weights w_ij (1 on the diagonal). */
  weightMatrix: number[][];
  weights: KappaWeights;
}

/**
 * Agreement weights over K ordered categories at 0-based positions: identity for unweighted,
 * 1 − |i − j|/(K − 1) for linear, 1 − ((i − j)/(K − 1))² for quadratic.
 *
 * @example
 * kappaWeightMatrix(3, 'linear'); // [[1, 0.5, 0], [0.5, 1, 0.5], [0, 0.5, 1]]
 */
export function kappaWeightMatrix(K: number, weights: KappaWeights): number[][] {
  requireInteger('categories', K, { min: 1 });
  requireOneOf('weights', weights, WEIGHTINGS);
  return Array.from({ length: K }, (_, i) =>
    Array.from({ length: K }, (_, j) => {
      if (i === j) return 1;
      if (weights === 'none' || K === 1) return 0;
      const gap = Math.abs(i - j) / (K - 1);
      return weights === 'linear' ? 1 - gap : 1 - gap * gap;
    }),
  );
}

/**
 * Cohen's kappa from a K×K agreement table (rows rater 1, columns rater 2), with optional linear
 * or quadratic weights over the table's positions. When chance agreement is already 1 there is no
 * variation, and κ is 1 when the observed agreement is perfect.
 *
 * @example
 * cohenKappaFromTable([[20, 5], [10, 15]]).kappa; // 0.4
 * cohenKappaFromTable([[0, 4, 1], [0, 8, 0], [0, 1, 5]], { weights: 'linear' }).kappa; // 0.4701
 */
export function cohenKappaFromTable(
  table: readonly (readonly number[])[],
  options: { weights?: KappaWeights } = {},
): KappaDetails {
  const opts = requireObject('options', options);
  const weights: KappaWeights =
    opts.weights === undefined ? 'none' : requireOneOf('options.weights', opts.weights, WEIGHTINGS);
  const rows = requireArray<unknown>('table', table);
  const K = rows.length;
  if (K === 0) throw new ScoringInputError('table', 'needs at least one category');
  const counts = rows.map((row, i) => {
    const cells = requireArray<unknown>(`table[${i}]`, row);
    if (cells.length !== K) throw new ScoringInputError(`table[${i}]`, `must have ${K} cells, got ${cells.length}`);
    return cells.map((x, j) => requireFinite(`table[${i}][${j}]`, x, { min: 0 }));
  });
  const n = counts.reduce((s, row) => s + row.reduce((t, x) => t + x, 0), 0);
  if (n === 0) throw new ScoringInputError('table', 'has no rated pairs');
  const w = kappaWeightMatrix(K, weights);
  const rowP = counts.map((row) => row.reduce((s, x) => s + x, 0) / n);
  const colP = counts[0].map((_, j) => counts.reduce((s, row) => s + row[j], 0) / n);
  let po = 0;
  let pe = 0;
  // κ = (p_o − p_e)/(1 − p_e) = 1 − q_o/q_e with q = 1 − p the disagreements. Summing the
  // disagreements keeps perfect agreement exactly 1 (q_o is then a sum of zeros), where summing
  // agreements can stop a rounding error short of it.
  let qo = 0;
  let qe = 0;
  for (let i = 0; i < K; i += 1) {
    for (let j = 0; j < K; j += 1) {
      const observed = counts[i][j] / n;
      const expected = rowP[i] * colP[j];
      po += w[i][j] * observed;
      pe += w[i][j] * expected;
      qo += (1 - w[i][j]) * observed;
      qe += (1 - w[i][j]) * expected;
    }
  }
  // No expected disagreement means both raters used one category throughout (disagreement
  // weights are positive off the diagonal), so the observed agreement is perfect too.
  const kappa = qe === 0 ? 1 : 1 - qo / qe;
  return { kappa, po, pe, n, table: counts, weightMatrix: w, weights };
}

/**
 * Cohen's kappa details from two raters' rating lists (same units, same order). Pairs with a
 * missing rating are dropped. Weighted kappa spaces its weights over `categories` (the whole
 * rating scale) when given, else over the sorted union of the values both raters used —
 * positions, not values.
 *
 * @example
 * cohenKappaDetails([0, 1, 2, 2], [0, 1, 2, 1], { weights: 'linear', categories: [0, 1, 2, 3, 4, 5, 6] });
 */
export function cohenKappaDetails(
  r1: readonly Rating[],
  r2: readonly Rating[],
  options: { weights?: KappaWeights; categories?: readonly (number | string)[] } = {},
): KappaDetails & { categories: (number | string)[] } {
  const a = requireArray<Rating>('r1', r1);
  const b = requireArray<Rating>('r2', r2);
  if (a.length !== b.length) {
    throw new ScoringInputError(
      'r2',
      `has ${b.length} ratings where r1 has ${a.length}; both must rate the same units`,
    );
  }
  const opts = requireObject('options', options);
  const pairs: [number | string, number | string][] = [];
  for (let i = 0; i < a.length; i += 1) {
    const x = a[i];
    const y = b[i];
    if (x === null || x === undefined || y === null || y === undefined) continue;
    for (const [field, value] of [
      [`r1[${i}]`, x],
      [`r2[${i}]`, y],
    ] as const) {
      if (typeof value === 'number') requireFinite(field, value);
      else if (typeof value !== 'string') throw new ScoringInputError(field, 'must be a number, a string or null');
    }
    pairs.push([x, y]);
  }
  if (pairs.length === 0) throw new ScoringInputError('r1', 'no unit was rated by both raters');

  let categories: (number | string)[];
  if (opts.categories !== undefined) {
    categories = [...requireArray<number | string>('options.categories', opts.categories)];
    if (categories.length === 0) throw new ScoringInputError('options.categories', 'must not be empty');
    if (new Set(categories).size !== categories.length) {
      throw new ScoringInputError('options.categories', 'lists a category twice');
    }
  } else {
    const seen = new Set<number | string>();
    for (const [x, y] of pairs) {
      seen.add(x);
      seen.add(y);
    }
    categories = [...seen];
    const allNumbers = categories.every((c) => typeof c === 'number');
    const allStrings = categories.every((c) => typeof c === 'string');
    if (!allNumbers && !allStrings) {
      throw new ScoringInputError('r1', 'mixes numbers and labels; pass options.categories to order them');
    }
    categories.sort(
      allNumbers ? (p, q) => (p as number) - (q as number) : (p, q) => ((p as string) < (q as string) ? -1 : 1),
    );
  }
  const position = new Map(categories.map((c, i) => [c, i]));
  const K = categories.length;
  const table = Array.from({ length: K }, () => new Array<number>(K).fill(0));
  for (const [x, y] of pairs) {
    const i = position.get(x);
    const j = position.get(y);
    if (i === undefined) throw new ScoringInputError('r1', `rating ${JSON.stringify(x)} is not in options.categories`);
    if (j === undefined) throw new ScoringInputError('r2', `rating ${JSON.stringify(y)} is not in options.categories`);
    table[i][j] += 1;
  }
  return {
    ...cohenKappaFromTable(table, { weights: (opts.weights as KappaWeights | undefined) ?? 'none' }),
    categories,
  };
}

/**
 * Cohen's kappa for two raters (unweighted, linear or quadratic); see {@link cohenKappaDetails}.
 *
 * @example
 * cohenKappa([1, 1, 0, 0], [1, 0, 0, 0]); // 0.5
 * cohenKappa([0, 3, 6], [1, 3, 6], { weights: 'quadratic', categories: [0, 1, 2, 3, 4, 5, 6] });
 */
export function cohenKappa(
  r1: readonly Rating[],
  r2: readonly Rating[],
  options: { weights?: KappaWeights; categories?: readonly (number | string)[] } = {},
): number {
  return cohenKappaDetails(r1, r2, options).kappa;
}

// ---------------------------------------------------------------------------------------------
// Fleiss' kappa
// ---------------------------------------------------------------------------------------------

/**
 * Fleiss' kappa with its parts.
 *
 * @example
 * const d: FleissDetails = fleissKappaDetails([[2, 0], [0, 2]]);
 * d.kappa; // 1
 */
export interface FleissDetails {
  kappa: number;
  /** Mean agreement over subjects, P̄. */
  pBar: number;
  /** Chance agreement P̄_e = Σ p_j². */
  peBar: number;
  /** Share of all ratings in each category. */
  pj: number[];
  /** Agreement within each subject. */
  Pi: number[];
  /** Raters per subject. */
  raters: number;
}

/**
 * Fleiss' kappa with its parts, for many raters: rows are subjects, columns the number of raters
 * who put the subject in each category; every subject needs the same number of raters (≥ 2).
 *
 * @example
 * fleissKappaDetails([[3, 0], [0, 3], [2, 1]]).pBar; // 0.7778
 */
export function fleissKappaDetails(counts: readonly (readonly number[])[]): FleissDetails {
  const rows = requireArray<unknown>('counts', counts);
  if (rows.length === 0) throw new ScoringInputError('counts', 'needs at least one subject');
  const table = rows.map((row, i) =>
    requireArray<unknown>(`counts[${i}]`, row).map((x, j) => requireInteger(`counts[${i}][${j}]`, x, { min: 0 })),
  );
  const K = table[0].length;
  if (K === 0) throw new ScoringInputError('counts[0]', 'needs at least one category');
  const raters = table[0].reduce((s, x) => s + x, 0);
  table.forEach((row, i) => {
    if (row.length !== K)
      throw new ScoringInputError(`counts[${i}]`, `has ${row.length} categories where row 0 has ${K}`);
    const m = row.reduce((s, x) => s + x, 0);
    if (m !== raters) {
      throw new ScoringInputError(
        `counts[${i}]`,
        `has ${m} ratings where row 0 has ${raters}; every subject needs the same number of raters`,
      );
    }
  });
  if (raters < 2) throw new ScoringInputError('counts', 'needs at least two raters per subject');
  const N = table.length;
  const Pi = table.map((row) => (row.reduce((s, x) => s + x * x, 0) - raters) / (raters * (raters - 1)));
  const pBar = Pi.reduce((s, x) => s + x, 0) / N;
  const pj = Array.from({ length: K }, (_, j) => table.reduce((s, row) => s + row[j], 0) / (N * raters));
  const peBar = pj.reduce((s, p) => s + p * p, 0);
  const kappa = peBar >= 1 - 1e-12 ? 1 : (pBar - peBar) / (1 - peBar);
  return { kappa, pBar, peBar, pj, Pi, raters };
}

/**
 * Fleiss' kappa for many raters; see {@link fleissKappaDetails}.
 *
 * @example
 * fleissKappa([[0, 0, 0, 0, 14], [0, 2, 6, 4, 2], [0, 0, 3, 5, 6], [0, 3, 9, 2, 0], [2, 2, 8, 1, 1],
 *   [7, 7, 0, 0, 0], [3, 2, 6, 3, 0], [2, 5, 3, 2, 2], [6, 5, 2, 1, 0], [0, 2, 2, 3, 7]]); // 0.2099
 */
export function fleissKappa(counts: readonly (readonly number[])[]): number {
  return fleissKappaDetails(counts).kappa;
}

// ---------------------------------------------------------------------------------------------
// Interpretation and flags
// ---------------------------------------------------------------------------------------------

/**
 * Krippendorff's reading of alpha: ≥ 0.800 reliable, 0.667 ≤ α < 0.800 tentative, below that
 * unreliable (Krippendorff 2011).
 *
 * @example
 * interpretAlpha(0.815); // 'reliable'
 * interpretAlpha(0.7); // 'tentative'
 */
export function interpretAlpha(alpha: number): 'reliable' | 'tentative' | 'unreliable' {
  requireFinite('alpha', alpha, { max: 1 });
  if (alpha >= ALPHA_THRESHOLDS.reliable) return 'reliable';
  if (alpha >= ALPHA_THRESHOLDS.tentative) return 'tentative';
  return 'unreliable';
}

/**
 * Landis & Koch (1977) words for kappa: < 0 poor, ≤ 0.20 slight, ≤ 0.40 fair, ≤ 0.60 moderate,
 * ≤ 0.80 substantial, above almost perfect.
 *
 * @example
 * interpretKappa(0.4); // 'fair'
 * interpretKappa(0.81); // 'almost perfect'
 */
export function interpretKappa(
  kappa: number,
): 'poor' | 'slight' | 'fair' | 'moderate' | 'substantial' | 'almost perfect' {
  requireFinite('kappa', kappa, { max: 1 });
  if (kappa < 0) return 'poor';
  for (const band of KAPPA_BANDS) if (kappa <= band.max) return band.label;
  return 'almost perfect';
}

/**
 * Units (0-based column indices) whose present ratings span `minSpan` bands or more
 * (max − min ≥ minSpan), so the author can resolve them with the reviewers.
 *
 * @example
 * spreadFlags([[4, 2, null], [5, 4, 6], [4, 3, 1]]); // [1, 2]
 */
export function spreadFlags(matrix: RatingMatrix, minSpan: number = DEFAULT_SPREAD_FLAG): number[] {
  requireFinite('minSpan', minSpan, { min: 0, minExclusive: true });
  const { raters, units, rows } = readMatrix(matrix);
  const flagged: number[] = [];
  for (let u = 0; u < units; u += 1) {
    let lo = Infinity;
    let hi = -Infinity;
    for (let r = 0; r < raters; r += 1) {
      const value = rows[r][u];
      if (value === null) continue;
      if (value < lo) lo = value;
      if (value > hi) hi = value;
    }
    if (hi - lo >= minSpan) flagged.push(u);
  }
  return flagged;
}

/**
 * Published data sets the statistics tests reproduce. Each names where the numbers were read.
 *
 * @example
 * import { BCG } from './fixtures';
 */

/**
 * BCG vaccine trials (Colditz et al. 1994, JAMA 271:698–702), as in metafor/metadat `dat.bcg`
 * (R package metadat): [tpos, tneg, cpos, cneg] = TB+ / TB− vaccinated, TB+ / TB− control.
 */
export const BCG: readonly (readonly [number, number, number, number])[] = [
  [4, 119, 11, 128],
  [6, 300, 29, 274],
  [3, 228, 11, 209],
  [62, 13536, 248, 12619],
  [33, 5036, 47, 5761],
  [180, 1361, 372, 1079],
  [8, 2537, 10, 619],
  [505, 87886, 499, 87892],
  [29, 7470, 45, 7232],
  [17, 1699, 65, 1600],
  [186, 50448, 141, 27197],
  [5, 2493, 3, 2338],
  [27, 16886, 29, 17825],
];

/**
 * Kacker (2004) interlaboratory example, as given to R metafor in statsmodels'
 * statsmodels/stats/tests/results/results_meta.py.
 */
export const KACKER = {
  yi: [61.0, 61.4, 62.21, 62.3, 62.34, 62.6, 62.7, 62.84, 65.9],
  vi: [0.2025, 1.21, 0.09, 0.2025, 0.3844, 0.5625, 0.0676, 0.0225, 1.8225],
};

/**
 * Teacher expectancy studies, Raudenbush & Bryk (1985, Table 1), as metadat's
 * `dat.raudenbush1985` (yi and vi to four decimals, checked against metadat in a public R
 * package's data-raw/raudenbush.R; yi and vi rounded also appear in metafor's
 * tests/testthat/test_misc_dfround.r).
 */
export const RAUDENBUSH = {
  yi: [
    0.03, 0.12, -0.14, 1.18, 0.26, -0.06, -0.02, -0.32, 0.27, 0.8, 0.54, 0.18, -0.02, 0.23, -0.18, -0.06, 0.3, 0.07,
    -0.07,
  ],
  vi: [
    0.0156, 0.0216, 0.0279, 0.1391, 0.1362, 0.0106, 0.0106, 0.0484, 0.0269, 0.063, 0.0912, 0.0497, 0.0835, 0.0841,
    0.0253, 0.0279, 0.0193, 0.0088, 0.0303,
  ],
};

/**
 * Krippendorff (2011), Computing Krippendorff's Alpha-Reliability (Annenberg School for
 * Communication, departmental paper 43): 4 observers × 12 units, null = missing.
 */
export const KRIPPENDORFF_2011 = [
  [1, 2, 3, 3, 2, 1, 4, 1, 2, null, null, null],
  [1, 2, 3, 3, 2, 2, 4, 1, 2, 5, null, 3],
  [null, 3, 3, 3, 2, 3, 4, 2, 2, 5, 1, null],
  [1, 2, 3, 3, 2, 4, 4, 1, 2, 5, 1, null],
];

/**
 * Anxiety ratings, 20 subjects × 3 raters (R package irr, `anxiety`), as listed in statsmodels'
 * statsmodels/stats/tests/test_inter_rater.py.
 */
const ANXIETY_FLAT = [
  3, 3, 3, 4, 5, 5, 2, 3, 5, 2, 2, 6, 1, 5, 2, 2, 1, 2, 4, 3, 3, 6, 4, 6, 2, 4, 2, 4, 3, 3, 2, 3, 3, 3, 2, 2, 1, 3, 3,
  4, 2, 1, 4, 4, 3, 2, 1, 6, 1, 1, 1, 2, 3, 3, 1, 1, 3, 3, 2, 2,
];
export const ANXIETY = {
  rater1: ANXIETY_FLAT.slice(0, 20),
  rater2: ANXIETY_FLAT.slice(20, 40),
  rater3: ANXIETY_FLAT.slice(40, 60),
};

/**
 * Fleiss (1971) psychiatric diagnoses, 30 subjects × 6 raters, categories 1…5 (R package irr,
 * `diagnoses`), as listed in statsmodels' statsmodels/stats/tests/test_inter_rater.py.
 */
export const DIAGNOSES = [
  [4, 4, 4, 4, 4, 4],
  [2, 2, 2, 5, 5, 5],
  [2, 3, 3, 3, 3, 5],
  [5, 5, 5, 5, 5, 5],
  [2, 2, 2, 4, 4, 4],
  [1, 1, 3, 3, 3, 3],
  [3, 3, 3, 3, 5, 5],
  [1, 1, 3, 3, 3, 4],
  [1, 1, 4, 4, 4, 4],
  [5, 5, 5, 5, 5, 5],
  [1, 4, 4, 4, 4, 4],
  [1, 2, 4, 4, 4, 4],
  [2, 2, 2, 3, 3, 3],
  [1, 4, 4, 4, 4, 4],
  [2, 2, 4, 4, 4, 5],
  [3, 3, 3, 3, 3, 5],
  [1, 1, 1, 4, 5, 5],
  [1, 1, 1, 1, 1, 2],
  [2, 2, 4, 4, 4, 4],
  [1, 3, 3, 5, 5, 5],
  [5, 5, 5, 5, 5, 5],
  [2, 4, 4, 4, 4, 4],
  [2, 2, 4, 5, 5, 5],
  [1, 1, 4, 4, 4, 4],
  [1, 4, 4, 4, 4, 5],
  [2, 2, 2, 2, 2, 4],
  [1, 1, 1, 1, 5, 5],
  [2, 2, 4, 4, 4, 4],
  [1, 3, 3, 3, 3, 3],
  [5, 5, 5, 5, 5, 5],
];

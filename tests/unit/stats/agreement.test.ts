import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { alpha as oracleAlpha, coincidenceMatrix as oracleCoincidence } from 'krippendorff';
import {
  coincidenceMatrix,
  cohenKappa,
  cohenKappaDetails,
  cohenKappaFromTable,
  fleissKappa,
  fleissKappaDetails,
  interpretAlpha,
  interpretKappa,
  kappaWeightMatrix,
  krippendorffAlpha,
  krippendorffAlphaDetails,
  spreadFlags,
  type AlphaMetric,
  type RatingMatrix,
} from '@/lib/stats/agreement';
import { ScoringInputError } from '@/lib/scoring/errors';
import { ANXIETY, DIAGNOSES, KRIPPENDORFF_2011 } from './fixtures';

const near = (value: number, published: number, tolerance: number) =>
  expect(Math.abs(value - published)).toBeLessThanOrEqual(tolerance);

describe("Krippendorff's alpha — Krippendorff (2011), Computing Krippendorff's Alpha-Reliability, 4 observers × 12 units", () => {
  it('nominal 0.743 (= 113/152)', () => {
    near(krippendorffAlpha(KRIPPENDORFF_2011, { metric: 'nominal' }), 113 / 152, 1e-12);
  });
  it.each([
    ['ordinal', 0.815],
    ['interval', 0.849],
    ['ratio', 0.797],
  ] as const)('%s %s (3 decimals → 5e-4)', (metric, published) => {
    near(krippendorffAlpha(KRIPPENDORFF_2011, { metric }), published, 5e-4);
  });

  it('defaults to the ordinal metric', () => {
    expect(krippendorffAlpha(KRIPPENDORFF_2011)).toBe(krippendorffAlpha(KRIPPENDORFF_2011, { metric: 'ordinal' }));
  });

  it('drops unit 12 (one rating) and keeps 11 units, n = 40 pairable values', () => {
    const c = coincidenceMatrix(KRIPPENDORFF_2011);
    expect(c.unitsDropped).toEqual([11]);
    expect(c.unitsUsed).toHaveLength(11);
    expect(c.n).toBe(40);
    expect(c.values).toEqual([1, 2, 3, 4, 5]);
    // Marginals n_c 9, 13, 10, 5, 3 as tabulated in Krippendorff (2011) (from memory).
    expect(c.totals.map((x) => Math.round(x * 1e9) / 1e9)).toEqual([9, 13, 10, 5, 3]);
  });
});

describe("Krippendorff's alpha — the krippendorff npm package 0.1.0 as an independent oracle", () => {
  // The package's own test reproduces Wikipedia's computational example (nominal α 0.691) and its
  // coincidence matrix; we run the same matrix through both implementations.
  const u = null;
  const wikipedia: RatingMatrix = [
    [u, u, u, u, u, 3, 4, 1, 2, 1, 1, 3, 3, u, 3],
    [1, u, 2, 1, 3, 3, 4, 3, u, u, u, u, u, u, u],
    [u, u, 2, 1, 3, 4, 4, u, 2, 1, 1, 3, 3, u, 4],
  ];
  const toOracle = (m: RatingMatrix) => m.map((row) => row.map((x) => (x === null ? undefined : x)));

  it('reproduces the Wikipedia example: nominal α 0.691 and its coincidence matrix', () => {
    near(krippendorffAlpha(wikipedia, { metric: 'nominal' }), 0.691, 5e-4);
    const ours = coincidenceMatrix(wikipedia).matrix;
    const theirs = oracleCoincidence(toOracle(wikipedia)).map((row) => row.map((x) => x ?? 0));
    expect(ours).toEqual(theirs);
    expect(ours).toEqual([
      [6, 0, 1, 0],
      [0, 4, 0, 0],
      [1, 0, 7, 2],
      [0, 0, 2, 3],
    ]);
  });

  const metrics: Record<Exclude<AlphaMetric, 'ordinal'>, (a: number, b: number) => number> = {
    nominal: (a, b) => (a === b ? 0 : 1),
    interval: (a, b) => (a - b) ** 2,
    ratio: (a, b) => (a + b === 0 ? 0 : ((a - b) / (a + b)) ** 2),
  };

  it.each(Object.keys(metrics) as (keyof typeof metrics)[])(
    'agrees with the package for random %s data (property)',
    (metric) => {
      const matrix = fc
        .tuple(fc.integer({ min: 2, max: 6 }), fc.integer({ min: 1, max: 12 }))
        .chain(([raters, units]) =>
          fc.array(
            fc.array(fc.option(fc.integer({ min: 0, max: 6 }), { nil: null, freq: 4 }), {
              minLength: units,
              maxLength: units,
            }),
            {
              minLength: raters,
              maxLength: raters,
            },
          ),
        );
      fc.assert(
        fc.property(matrix, (m) => {
          let details;
          try {
            details = krippendorffAlphaDetails(m, { metric });
          } catch (error) {
            // Only "no unit has two ratings" may refuse; the package returns NaN there.
            expect(error).toBeInstanceOf(ScoringInputError);
            return;
          }
          if (details.expectedDisagreement === 0) return; // no variation: we return 1, the package NaN
          near(details.alpha, oracleAlpha(toOracle(m), metrics[metric]), 1e-9);
        }),
        { numRuns: 300 },
      );
    },
  );
});

describe("Krippendorff's alpha — rules", () => {
  it('is 1 for perfect agreement, for every metric (property)', () => {
    const unitValues = fc.array(fc.integer({ min: 0, max: 6 }), { minLength: 1, maxLength: 10 });
    fc.assert(
      fc.property(
        unitValues,
        fc.integer({ min: 2, max: 5 }),
        fc.constantFrom('nominal', 'ordinal', 'interval', 'ratio' as const),
        (values, raters, metric) => {
          const matrix = Array.from({ length: raters }, () => [...values]);
          expect(krippendorffAlpha(matrix, { metric })).toBe(1);
        },
      ),
    );
  });

  it('is 1 when every rating is the same value (no variation, D_e = 0)', () => {
    const d = krippendorffAlphaDetails([
      [3, 3, null],
      [3, 3, 3],
    ]);
    expect(d.expectedDisagreement).toBe(0);
    expect(d.alpha).toBe(1);
  });

  it('ordinal metric follows δ²_ck = (Σ_{g=c..k} n_g − (n_c + n_k)/2)² (Krippendorff 2011)', () => {
    // Two units rated (1, 2) and (2, 3): n_1 = 1, n_2 = 2, n_3 = 1, n = 4.
    const d = krippendorffAlphaDetails(
      [
        [1, 2],
        [2, 3],
      ],
      { metric: 'ordinal' },
    );
    // δ²(1,2) = (1 + 2 − 1.5)² = 2.25; δ²(2,3) = 2.25; δ²(1,3) = (4 − 1)² = 9.
    const Do = (2 * 2.25 + 2 * 2.25) / 4;
    const De = (2 * (1 * 2 * 2.25) + 2 * (2 * 1 * 2.25) + 2 * (1 * 1 * 9)) / (4 * 3);
    near(d.observedDisagreement, Do, 1e-12);
    near(d.expectedDisagreement, De, 1e-12);
    near(d.alpha, 1 - Do / De, 1e-12);
  });
});

describe("Cohen's kappa — published examples", () => {
  it('the widely reproduced 2×2 example: 50 items, 20 / 5 / 10 / 15 → p_o 0.70, p_e 0.50, κ 0.40', () => {
    const d = cohenKappaFromTable([
      [20, 5],
      [10, 15],
    ]);
    near(d.po, 0.7, 1e-12);
    near(d.pe, 0.5, 1e-12);
    near(d.kappa, 0.4, 1e-12);
    // the same from two rating lists (1 = yes, 0 = no)
    const a = [...Array(20).fill(1), ...Array(5).fill(1), ...Array(10).fill(0), ...Array(15).fill(0)];
    const b = [...Array(20).fill(1), ...Array(5).fill(0), ...Array(10).fill(1), ...Array(15).fill(0)];
    near(cohenKappa(a, b), 0.4, 1e-12);
  });

  it('SAS PROC FREQ 3×3 example (statsmodels test_inter_rater.py): simple κ 0.4842, linear-weighted κ 0.4701', () => {
    const table = [
      [0, 4, 1],
      [0, 8, 0],
      [0, 1, 5],
    ];
    near(cohenKappaFromTable(table).kappa, 0.4842, 1e-4);
    near(cohenKappaFromTable(table, { weights: 'linear' }).kappa, 0.4701, 1e-4);
  });

  it('R irr kappa2 on anxiety raters 2 and 3 (statsmodels test_inter_rater.py): −0.006289308, linear 0.1459075, squared 0.2520325', () => {
    // Values 1, 2, 3, 4, 6 are used (no 5): weights are spaced over those five positions.
    near(cohenKappa(ANXIETY.rater2, ANXIETY.rater3), -0.006289308, 1e-9);
    near(cohenKappa(ANXIETY.rater2, ANXIETY.rater3, { weights: 'linear' }), 0.1459075, 1e-7);
    near(cohenKappa(ANXIETY.rater2, ANXIETY.rater3, { weights: 'quadratic' }), 0.2520325, 1e-7);
    expect(cohenKappaDetails(ANXIETY.rater2, ANXIETY.rater3).categories).toEqual([1, 2, 3, 4, 6]);
  });
});

describe("Cohen's kappa — weights over categories (docs/scoring.md §7 precise rules)", () => {
  /** Independent textbook form: κ_w = 1 − Σ v_ij o_ij / Σ v_ij e_ij with disagreement v = 1 − w. */
  const weightedByHand = (r1: number[], r2: number[], scale: number[], kind: 'linear' | 'quadratic') => {
    const K = scale.length;
    const pos = (x: number) => scale.indexOf(x);
    const v = (i: number, j: number) => (kind === 'linear' ? Math.abs(i - j) / (K - 1) : ((i - j) / (K - 1)) ** 2);
    const n = r1.length;
    let observed = 0;
    for (let k = 0; k < n; k += 1) observed += v(pos(r1[k]), pos(r2[k]));
    let expected = 0;
    for (const x of r1) for (const y of r2) expected += v(pos(x), pos(y));
    return 1 - observed / n / (expected / (n * n));
  };

  it('spaces weights over the given categories (the whole 0…6 scale), not the values seen', () => {
    const scale = [0, 1, 2, 3, 4, 5, 6];
    const a = [1, 2, 3, 4, 6, 2, 3];
    const b = [2, 2, 4, 4, 6, 1, 3];
    for (const kind of ['linear', 'quadratic'] as const) {
      const withScale = cohenKappa(a, b, { weights: kind, categories: scale });
      near(withScale, weightedByHand(a, b, scale, kind), 1e-12);
      const observedOnly = cohenKappa(a, b, { weights: kind });
      near(observedOnly, weightedByHand(a, b, [1, 2, 3, 4, 6], kind), 1e-12);
      expect(withScale).not.toBeCloseTo(observedOnly, 6);
    }
  });

  it('builds linear and quadratic weight matrices from positions', () => {
    expect(kappaWeightMatrix(3, 'linear')).toEqual([
      [1, 0.5, 0],
      [0.5, 1, 0.5],
      [0, 0.5, 1],
    ]);
    expect(kappaWeightMatrix(3, 'quadratic')).toEqual([
      [1, 0.75, 0],
      [0.75, 1, 0.75],
      [0, 0.75, 1],
    ]);
    expect(kappaWeightMatrix(2, 'none')).toEqual([
      [1, 0],
      [0, 1],
    ]);
  });

  it('drops pairs with a missing rating', () => {
    expect(cohenKappaDetails([1, null, 0, 1, undefined], [1, 1, 0, null, 0]).n).toBe(2);
    expect(cohenKappa([1, null, 0], [1, 0, 0])).toBe(1);
  });

  it('orders string labels by the categories given', () => {
    const d = cohenKappaDetails(['low', 'high', 'mid'], ['mid', 'high', 'mid'], {
      weights: 'linear',
      categories: ['low', 'mid', 'high'],
    });
    expect(d.categories).toEqual(['low', 'mid', 'high']);
    expect(d.table[0][1]).toBe(1);
  });

  it('is 1 for perfect agreement with any weights (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 6 }), { minLength: 1, maxLength: 40 }),
        fc.constantFrom('none', 'linear', 'quadratic' as const),
        fc.boolean(),
        (ratings, weights, withScale) => {
          const options = withScale ? { weights, categories: [0, 1, 2, 3, 4, 5, 6] } : { weights };
          expect(cohenKappa(ratings, [...ratings], options)).toBe(1);
        },
      ),
    );
  });

  it('is 1 when both raters used one category throughout (p_e = 1)', () => {
    const d = cohenKappaDetails([4, 4, 4], [4, 4, 4], { weights: 'quadratic', categories: [0, 1, 2, 3, 4, 5, 6] });
    expect(d.pe).toBe(1);
    expect(d.kappa).toBe(1);
  });
});

describe("Fleiss' kappa", () => {
  it('the widely reproduced 10 subjects × 14 raters × 5 categories example: κ 0.210 (computed 0.209931)', () => {
    const counts = [
      [0, 0, 0, 0, 14],
      [0, 2, 6, 4, 2],
      [0, 0, 3, 5, 6],
      [0, 3, 9, 2, 0],
      [2, 2, 8, 1, 1],
      [7, 7, 0, 0, 0],
      [3, 2, 6, 3, 0],
      [2, 5, 3, 2, 2],
      [6, 5, 2, 1, 0],
      [0, 2, 2, 3, 7],
    ];
    near(fleissKappa(counts), 0.209931, 1e-6);
    const d = fleissKappaDetails(counts);
    expect(d.raters).toBe(14);
    // Per-subject agreement P_i as printed in that example (statsmodels test_inter_rater.py, table0 last column)
    [1.0, 0.253, 0.308, 0.44, 0.33, 0.462, 0.242, 0.176, 0.286, 0.286].forEach((p, i) => near(d.Pi[i], p, 5e-4));
  });

  it('Fleiss (1971) diagnoses, 30 subjects × 6 raters: κ 0.4302445 (R irr kappam.fleiss, statsmodels test_inter_rater.py)', () => {
    const counts = DIAGNOSES.map((row) => [1, 2, 3, 4, 5].map((c) => row.filter((x) => x === c).length));
    near(fleissKappa(counts), 0.4302445, 1e-7);
  });

  it('is 1 when every subject is put in one category by all raters (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 4 }), { minLength: 1, maxLength: 20 }),
        fc.integer({ min: 2, max: 9 }),
        (categories, raters) => {
          const counts = categories.map((c) => [0, 1, 2, 3, 4].map((k) => (k === c ? raters : 0)));
          expect(fleissKappa(counts)).toBe(1);
        },
      ),
    );
  });
});

describe('interpretation bands', () => {
  it.each([
    [1, 'reliable'],
    [0.8, 'reliable'],
    [0.7999, 'tentative'],
    [0.667, 'tentative'],
    [0.6669, 'unreliable'],
    [0, 'unreliable'],
    [-0.5, 'unreliable'],
  ] as const)('Krippendorff (2011): α %s → %s', (alpha, label) => {
    expect(interpretAlpha(alpha)).toBe(label);
  });

  it.each([
    [-0.01, 'poor'],
    [0, 'slight'],
    [0.2, 'slight'],
    [0.2001, 'fair'],
    [0.4, 'fair'],
    [0.4001, 'moderate'],
    [0.6, 'moderate'],
    [0.6001, 'substantial'],
    [0.8, 'substantial'],
    [0.8001, 'almost perfect'],
    [1, 'almost perfect'],
  ] as const)('Landis & Koch (1977), Biometrics 33:159–174: κ %s → %s', (kappa, label) => {
    expect(interpretKappa(kappa)).toBe(label);
  });

  it('rejects values that are not coefficients', () => {
    expect(() => interpretAlpha(Number.NaN)).toThrow(ScoringInputError);
    expect(() => interpretKappa(1.2)).toThrow(ScoringInputError);
  });
});

describe('spreadFlags', () => {
  it('flags units whose present ratings span 2 bands or more by default', () => {
    expect(
      spreadFlags([
        [4, 2, null, 6, 0],
        [5, 4, 6, 6, null],
        [4, 3, 1, 5, null],
      ]),
    ).toEqual([1, 2]);
  });

  it('takes another minimum span', () => {
    const m = [
      [4, 2, 0],
      [5, 4, 3],
    ];
    expect(spreadFlags(m, 1)).toEqual([0, 1, 2]);
    expect(spreadFlags(m, 3)).toEqual([2]);
  });

  it('never flags a unit with fewer than two ratings', () => {
    expect(
      spreadFlags([
        [0, null],
        [null, null],
        [null, 6],
      ]),
    ).toEqual([]);
  });

  it('rejects a non-positive span', () => {
    expect(() => spreadFlags([[1, 2]], 0)).toThrow(ScoringInputError);
  });
});

describe('agreement — bad input', () => {
  it.each([
    [() => krippendorffAlpha([]), 'ratings'],
    [() => krippendorffAlpha([[]]), 'ratings[0]'],
    [() => krippendorffAlpha([[1, 2], [1]]), 'ratings[1]'],
    [
      () =>
        krippendorffAlpha([
          [1, 2],
          [1, Number.NaN],
        ]),
      'ratings[1][1]',
    ],
    [() => krippendorffAlpha([[1, '2' as unknown as number]]), 'ratings[0][1]'],
    [
      () =>
        krippendorffAlpha([
          [1, null],
          [null, 2],
        ]),
      'ratings',
    ],
    [
      () =>
        krippendorffAlpha(
          [
            [1, -2],
            [1, -2],
          ],
          { metric: 'ratio' },
        ),
      'ratings',
    ],
    [
      () =>
        krippendorffAlpha(
          [
            [1, 2],
            [1, 2],
          ],
          { metric: 'cosine' as unknown as AlphaMetric },
        ),
      'options.metric',
    ],
    [() => cohenKappa([1, 2], [1]), 'r2'],
    [() => cohenKappa([null], [1]), 'r1'],
    [() => cohenKappa([1, 'a'], [1, 'a']), 'r1'],
    [() => cohenKappa([1, 7], [1, 2], { categories: [0, 1, 2, 3] }), 'r1'],
    [() => cohenKappa([1, 2], [1, 2], { categories: [] }), 'options.categories'],
    [() => cohenKappa([1, 2], [1, 2], { categories: [1, 1, 2] }), 'options.categories'],
    [() => cohenKappa([1, 2], [1, 2], { weights: 'cubic' as unknown as 'linear' }), 'options.weights'],
    [() => cohenKappaFromTable([]), 'table'],
    [
      () =>
        cohenKappaFromTable([
          [0, 0],
          [0, 0],
        ]),
      'table',
    ],
    [() => cohenKappaFromTable([[1, 2], [3]]), 'table[1]'],
    [() => fleissKappa([]), 'counts'],
    [
      () =>
        fleissKappa([
          [2, 1],
          [1, 1],
        ]),
      'counts[1]',
    ],
    [
      () =>
        fleissKappa([
          [1, 0],
          [0, 1],
        ]),
      'counts',
    ],
    [() => fleissKappa([[1.5, 0.5]]), 'counts[0][0]'],
    [() => fleissKappa([[-1, 3]]), 'counts[0][0]'],
  ])('throws a ScoringInputError (case %#) naming %s', (call, field) => {
    expect(call).toThrow(expect.objectContaining({ name: 'ScoringInputError', field }));
    expect(call).toThrow(ScoringInputError);
  });
});

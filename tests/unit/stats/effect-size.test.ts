import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import jStat from 'jstat';
import { logOddsRatio, logOddsRatioToD, logRiskRatio, seFromCI, smdFromMeans, smdFromT } from '@/lib/stats/effect-size';
import { ScoringInputError } from '@/lib/scoring/errors';
import { BCG } from './fixtures';

describe('smdFromMeans — Borenstein, Hedges, Higgins & Rothstein (2009), Introduction to Meta-Analysis, ch. 4 worked example', () => {
  // Means 103 / 100, SDs 5.5 / 4.5, n 50 / 50: the book's worked example.
  const r = smdFromMeans({ m1: 103, sd1: 5.5, n1: 50, m2: 100, sd2: 4.5, n2: 50 });
  it.each([
    ['S_within', r.sWithin, 5.0249],
    ['d', r.d, 0.597],
    ['V_d', r.vd, 0.0418],
    ['SE_d', Math.sqrt(r.vd), 0.2044],
    ['J', r.J, 0.9923],
    ['g', r.g, 0.5924],
    ['V_g', r.vg, 0.0411],
    ['SE_g', Math.sqrt(r.vg), 0.2028],
  ])('%s = %s ≈ %s (1e-4)', (_name, value, published) => {
    expect(Math.abs(value - published)).toBeLessThanOrEqual(1e-4);
  });

  it('has df = n1 + n2 − 2', () => {
    expect(r.df).toBe(98);
  });
});

describe('smdFromT — d = t·√(1/n1 + 1/n2) (Borenstein et al. 2009, ch. 7)', () => {
  it('gives the same d as the means when t comes from the same data', () => {
    // t for the ch. 4 example: (103 − 100) / (S_within · √(1/50 + 1/50)).
    const fromMeans = smdFromMeans({ m1: 103, sd1: 5.5, n1: 50, m2: 100, sd2: 4.5, n2: 50 });
    const t = 3 / (fromMeans.sWithin * Math.sqrt(1 / 50 + 1 / 50));
    const fromT = smdFromT({ t, n1: 50, n2: 50 });
    for (const key of ['d', 'vd', 'J', 'g', 'vg'] as const) expect(fromT[key]).toBeCloseTo(fromMeans[key], 12);
  });

  it('keeps the sign of t', () => {
    expect(smdFromT({ t: -2, n1: 10, n2: 12 }).d).toBeCloseTo(-2 * Math.sqrt(1 / 10 + 1 / 12), 14);
  });
});

describe('logRiskRatio and logOddsRatio — 2×2 tables', () => {
  it('reproduce the BCG log odds ratios listed on metafor-project.org ("van Houwelingen et al. (2002)" analysis, escalc measure OR)', () => {
    // trials 1–7, yi and vi to 4 decimals as printed there
    const published = [
      [-0.9387, 0.3571],
      [-1.6662, 0.2081],
      [-1.3863, 0.4334],
      [-1.4564, 0.0203],
      [-0.2191, 0.052],
      [-0.9581, 0.0099],
      [-1.6338, 0.227],
    ];
    published.forEach(([yi, vi], i) => {
      const [a, b, c, d] = BCG[i];
      const r = logOddsRatio({ a, b, c, d });
      expect(Math.abs(r.yi - yi)).toBeLessThanOrEqual(1e-4);
      expect(Math.abs(r.vi - vi)).toBeLessThanOrEqual(1e-4);
      expect(r.corrected).toBe(false);
    });
  });

  it('compute the log risk ratio by the textbook formula for every BCG trial (Borenstein et al. 2009, ch. 5 — from memory)', () => {
    for (const [a, b, c, d] of BCG) {
      const r = logRiskRatio({ a, b, c, d });
      expect(r.yi).toBeCloseTo(Math.log(a / (a + b) / (c / (c + d))), 14);
      expect(r.vi).toBeCloseTo(1 / a - 1 / (a + b) + 1 / c - 1 / (c + d), 14);
    }
  });

  it('add 0.5 to every cell when one cell is zero (continuity correction, docs/scoring.md)', () => {
    const rr = logRiskRatio({ a: 0, b: 10, c: 5, d: 5 });
    expect(rr.corrected).toBe(true);
    expect(rr.yi).toBeCloseTo(Math.log(0.5 / 11 / (5.5 / 11)), 14);
    expect(rr.vi).toBeCloseTo(1 / 0.5 - 1 / 11 + 1 / 5.5 - 1 / 11, 14);
    const or = logOddsRatio({ a: 3, b: 0, c: 5, d: 5 });
    expect(or.corrected).toBe(true);
    expect(or.yi).toBeCloseTo(Math.log((3.5 * 5.5) / (0.5 * 5.5)), 14);
    expect(or.vi).toBeCloseTo(1 / 3.5 + 1 / 0.5 + 1 / 5.5 + 1 / 5.5, 14);
  });

  it('leave a table without zero cells uncorrected', () => {
    expect(logOddsRatio({ a: 1, b: 1, c: 1, d: 1 })).toEqual({ yi: 0, vi: 4, corrected: false });
  });

  it('always give finite results for non-negative cells (property)', () => {
    const cell = fc.nat({ max: 10_000 });
    fc.assert(
      fc.property(cell, cell, cell, cell, (a, b, c, d) => {
        for (const r of [logRiskRatio({ a, b, c, d }), logOddsRatio({ a, b, c, d })]) {
          expect(Number.isFinite(r.yi)).toBe(true);
          expect(r.vi).toBeGreaterThanOrEqual(0);
          expect(Number.isFinite(r.vi)).toBe(true);
        }
      }),
    );
  });
});

describe('logOddsRatioToD — × √3/π (Borenstein et al. 2009, ch. 7)', () => {
  it('converts the ch. 7 example: log OR 0.9069, V 0.0676 → d 0.5000, V_d 0.0205 (from memory)', () => {
    const r = logOddsRatioToD(0.9069, 0.0676);
    expect(Math.abs(r.d - 0.5)).toBeLessThanOrEqual(1e-4);
    expect(Math.abs((r.vd as number) - 0.0205)).toBeLessThanOrEqual(1e-4);
  });

  it('uses exactly √3/π and 3/π²', () => {
    const r = logOddsRatioToD(Math.log(3), 0.2);
    expect(r.d).toBeCloseTo((Math.log(3) * Math.sqrt(3)) / Math.PI, 15);
    expect(r.vd).toBeCloseTo((0.2 * 3) / Math.PI ** 2, 15);
    expect(logOddsRatioToD(1).vd).toBeUndefined();
  });
});

describe('seFromCI', () => {
  it('recovers the BCG fixed-effect SE from its published 95 % CI (metafor test vs Stata metan: [−0.5097, −0.3509])', () => {
    // SE of that model is 0.0405 (computed); the 4-decimal limits pin it to ±1e-4.
    expect(Math.abs(seFromCI(-0.5097, -0.3509) - 0.0405)).toBeLessThanOrEqual(1e-4);
  });

  it('recovers metafor’s DL SE for the Kacker (2004) data from its CI (statsmodels results_meta.py)', () => {
    expect(seFromCI(61.9084781058787, 62.8717991030221)).toBeCloseTo(0.245749668040304, 9);
  });

  it('uses the normal quantile of the level from jstat', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -10, max: 10, noNaN: true }),
        fc.double({ min: 0.001, max: 5, noNaN: true }),
        fc.double({ min: 0.5, max: 0.999, noNaN: true }),
        (lo, width, level) => {
          const z = jStat.normal.inv((1 + level) / 2, 0, 1);
          expect(seFromCI(lo, lo + width, level)).toBeCloseTo((lo + width - lo) / (2 * z), 10);
        },
      ),
    );
  });
});

describe('effect sizes — bad input', () => {
  it.each([
    [() => smdFromMeans({ m1: 1, sd1: 1, n1: 1, m2: 0, sd2: 1, n2: 10 }), 'n1'],
    [() => smdFromMeans({ m1: 1, sd1: 1, n1: 10, m2: 0, sd2: 1, n2: 2.5 }), 'n2'],
    [() => smdFromMeans({ m1: 1, sd1: -1, n1: 10, m2: 0, sd2: 1, n2: 10 }), 'sd1'],
    [() => smdFromMeans({ m1: 1, sd1: 0, n1: 10, m2: 0, sd2: 0, n2: 10 }), 'sd1'],
    [() => smdFromMeans({ m1: Number.NaN, sd1: 1, n1: 10, m2: 0, sd2: 1, n2: 10 }), 'm1'],
    [() => smdFromT({ t: 1, n1: 10, n2: 0 }), 'n2'],
    [() => smdFromT({ t: Number.POSITIVE_INFINITY, n1: 10, n2: 10 }), 't'],
    [() => logRiskRatio({ a: -1, b: 2, c: 3, d: 4 }), 'a'],
    [() => logOddsRatio({ a: 1, b: 2, c: 3, d: Number.NaN }), 'd'],
    [() => logOddsRatioToD(0.5, -0.1), 'vi'],
    [() => seFromCI(1, 1), 'hi'],
    [() => seFromCI(2, 1), 'hi'],
    [() => seFromCI(0, 1, 95), 'level'],
    [() => seFromCI(0, 1, 0), 'level'],
  ])('throws a ScoringInputError (case %#) naming %s', (call, field) => {
    expect(call).toThrow(expect.objectContaining({ name: 'ScoringInputError', field }));
    expect(call).toThrow(ScoringInputError);
  });
});

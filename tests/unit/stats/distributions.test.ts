import { describe, expect, it } from 'vitest';
import { chiSquareUpperTail, normalQuantile, normalTwoSidedP, studentTQuantile } from '@/lib/stats/distributions';
import { ScoringInputError } from '@/lib/scoring/errors';

describe('distributions from jstat 1.9.6 (npm `jstat`, a general-purpose reference library from the registry)', () => {
  it('normal 97.5 % quantile 1.959964', () => {
    expect(Math.abs(normalQuantile(0.975) - 1.959964)).toBeLessThanOrEqual(1e-6);
  });

  it('Student t 97.5 % quantile with 11 df 2.200985', () => {
    expect(Math.abs(studentTQuantile(0.975, 11) - 2.200985)).toBeLessThanOrEqual(1e-6);
  });

  it('χ² upper tail for Q 24.801897741835 on 8 df = 0.00167935146372742 (R metafor QEp, statsmodels results_meta.py)', () => {
    expect(Math.abs(chiSquareUpperTail(24.801897741835, 8) - 0.00167935146372742)).toBeLessThanOrEqual(1e-10);
  });

  it('two-sided normal p is 0.05 at the 97.5 % quantile and 1 at z = 0', () => {
    expect(normalTwoSidedP(normalQuantile(0.975))).toBeCloseTo(0.05, 12);
    expect(normalTwoSidedP(-normalQuantile(0.975))).toBeCloseTo(0.05, 12);
    expect(normalTwoSidedP(0)).toBe(1);
  });

  it.each([
    [() => normalQuantile(0)],
    [() => normalQuantile(1)],
    [() => studentTQuantile(0.5, 0)],
    [() => chiSquareUpperTail(-1, 3)],
    [() => chiSquareUpperTail(1, 0)],
    [() => normalTwoSidedP(Number.NaN)],
  ])('rejects bad arguments (case %#)', (call) => {
    expect(call).toThrow(ScoringInputError);
  });
});

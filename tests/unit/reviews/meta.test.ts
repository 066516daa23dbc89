import { describe, expect, it } from 'vitest';
import { comparableEffect } from '@/lib/reviews/meta';

/**
 * Which family each kind of effect data joins, and on what scale (lib/reviews/meta.ts). The
 * numbers are checked against published worked examples, not against the code under test.
 */
describe('comparable effect sizes', () => {
  it('means → Hedges’ g and its variance (Borenstein et al. 2009, ch. 4 example: g 0.5924, V_g 0.0411)', () => {
    const e = comparableEffect({ kind: 'means', m1: 103, sd1: 5.5, n1: 50, m2: 100, sd2: 4.5, n2: 50 });
    expect(e.measure).toBe('smd');
    expect(e.effectSize).toBeCloseTo(0.5924, 4);
    expect(e.variance).toBeCloseTo(0.0411, 4);
    expect(e.converted).toBe(false);
  });

  it('t → d = t·√(1/n1 + 1/n2) (Borenstein et al. 2009, ch. 7), then Hedges’ correction J = 1 − 3/(4·df − 1)', () => {
    const e = comparableEffect({ kind: 't', t: 2.5, n1: 20, n2: 20 });
    const d = 2.5 * Math.sqrt(1 / 20 + 1 / 20);
    const J = 1 - 3 / (4 * 38 - 1);
    expect(e.measure).toBe('smd');
    expect(e.effectSize).toBeCloseTo(J * d, 12);
  });

  it('a 2×2 table as an odds ratio → d = ln OR · √3/π, joining the SMD family (Borenstein et al. 2009, ch. 7)', () => {
    const e = comparableEffect({ kind: 'two-by-two', a: 4, b: 119, c: 11, d: 128, measure: 'odds-ratio' });
    // dat.bcg trial 1: ln OR −0.9387, variance 0.3571 (metafor escalc, measure OR).
    expect(e.measure).toBe('smd');
    expect(e.effectSize).toBeCloseTo(-0.9387 * (Math.sqrt(3) / Math.PI), 4);
    expect(e.variance).toBeCloseTo(0.3571 * (3 / Math.PI ** 2), 4);
    expect(e.converted).toBe(true);
  });

  it('a 2×2 table as a risk ratio stays a log risk ratio (dat.bcg trial 1: −0.8893, 0.3256)', () => {
    const e = comparableEffect({ kind: 'two-by-two', a: 4, b: 119, c: 11, d: 128, measure: 'risk-ratio' });
    expect(e).toMatchObject({ measure: 'log-risk-ratio', converted: false });
    expect(e.effectSize).toBeCloseTo(-0.8893, 4);
    expect(e.variance).toBeCloseTo(0.3256, 4);
  });

  it('ready values: an SMD as given, a log OR converted, a log RR in its own family', () => {
    expect(comparableEffect({ kind: 'ready', effectSize: 0.4, variance: 0.04, measure: 'smd' })).toEqual({
      measure: 'smd',
      effectSize: 0.4,
      variance: 0.04,
      converted: false,
    });
    const or = comparableEffect({ kind: 'ready', effectSize: Math.log(3), variance: 0.2, measure: 'log-odds-ratio' });
    expect(or.effectSize).toBeCloseTo(Math.log(3) * (Math.sqrt(3) / Math.PI), 12);
    expect(
      comparableEffect({ kind: 'ready', effectSize: -0.2, variance: 0.01, measure: 'log-risk-ratio' }).measure,
    ).toBe('log-risk-ratio');
  });
});

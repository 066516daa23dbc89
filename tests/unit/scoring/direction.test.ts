import { describe, expect, it } from 'vitest';
import { effectConflict, orientEffect, suggestDirection } from '@/lib/scoring/direction';
import { ScoringInputError } from '@/lib/scoring/errors';

// The worked example and the rules are those of docs/scoring.md §10.

describe('orientEffect', () => {
  it('keeps y when higher is desirable and negates it when lower is', () => {
    expect(orientEffect(0.3)).toBe(0.3);
    expect(orientEffect(0.3, 'higher')).toBe(0.3);
    expect(orientEffect(-0.25, 'lower')).toBe(0.25);
    expect(orientEffect(0.4, 'lower')).toBe(-0.4);
  });
  it('refuses an unknown direction', () => {
    expect(() => orientEffect(1, 'up' as never)).toThrow(ScoringInputError);
  });
});

describe('suggestDirection', () => {
  it('the example: a pain trial, lower desirable, y −0.25, v 0.04 → neutral (0.25 ± 0.392 spans 0)', () => {
    expect(suggestDirection({ y: -0.25, v: 0.04, desirable: 'lower' })).toBe('neutral');
  });
  it('supports when the oriented interval is above 0, against when below', () => {
    // se 0.1, half-width 0.196
    expect(suggestDirection({ y: 0.2, v: 0.01 })).toBe('supports');
    expect(suggestDirection({ y: -0.2, v: 0.01 })).toBe('against');
    expect(suggestDirection({ y: -0.2, v: 0.01, desirable: 'lower' })).toBe('supports');
    expect(suggestDirection({ y: 0.2, v: 0.01, desirable: 'lower' })).toBe('against');
    expect(suggestDirection({ y: 0.19, v: 0.01 })).toBe('neutral');
  });
  it('uses z = 1.959964: an interval that just touches 0 is neutral', () => {
    const y = 1.959964 * 0.1;
    expect(suggestDirection({ y, v: 0.01 })).toBe('neutral');
    expect(suggestDirection({ y: y + 1e-9, v: 0.01 })).toBe('supports');
  });
  it('throws on a variance that is not above 0 and finite, or a non-finite effect', () => {
    for (const v of [0, -0.1, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => suggestDirection({ y: 0.2, v })).toThrow(ScoringInputError);
    }
    expect(() => suggestDirection({ y: Number.NaN, v: 0.1 })).toThrow(ScoringInputError);
    expect(() => suggestDirection({ y: Number.POSITIVE_INFINITY, v: 0.1 })).toThrow(ScoringInputError);
  });
});

describe('effectConflict', () => {
  it('the example: pooled 0.05 [−0.22, 0.33] with P 0.90 → conflict', () => {
    expect(effectConflict({ pooled: { estimate: 0.05, ciLow: -0.22, ciHigh: 0.33 }, outcomeProbability: 0.9 })).toBe(
      true,
    );
  });
  it('neutral pooled: conflict from P ≥ 0.66', () => {
    const pooled = { estimate: 0.05, ciLow: -0.22, ciHigh: 0.33 };
    expect(effectConflict({ pooled, outcomeProbability: 0.66 })).toBe(true);
    expect(effectConflict({ pooled, outcomeProbability: 0.65 })).toBe(false);
  });
  it('against pooled: conflict from P ≥ 0.33', () => {
    const pooled = { estimate: -0.4, ciLow: -0.6, ciHigh: -0.2 };
    expect(effectConflict({ pooled, outcomeProbability: 0.33 })).toBe(true);
    expect(effectConflict({ pooled, outcomeProbability: 0.32 })).toBe(false);
  });
  it('supporting pooled: conflict below P 0.33', () => {
    const pooled = { estimate: 0.4, ciLow: 0.2, ciHigh: 0.6 };
    expect(effectConflict({ pooled, outcomeProbability: 0.32 })).toBe(true);
    expect(effectConflict({ pooled, outcomeProbability: 0.33 })).toBe(false);
    expect(effectConflict({ pooled, outcomeProbability: 0.9 })).toBe(false);
  });
  it('refuses a probability outside 0..1', () => {
    expect(() => effectConflict({ pooled: { estimate: 0, ciLow: -1, ciHigh: 1 }, outcomeProbability: 1.2 })).toThrow(
      ScoringInputError,
    );
  });
});

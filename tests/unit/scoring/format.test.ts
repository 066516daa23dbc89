import { describe, expect, it } from 'vitest';
import { formatNumber, formatPercent, formatSigned } from '@/lib/scoring/format';

// How the working steps print numbers (our model: four decimals so a reader can redo a step).
describe('number formatting in working steps', () => {
  it.each([
    [-0.71412, undefined, '−0.7141'],
    [0.5, undefined, '0.5'],
    [1.38629, 2, '1.39'],
    [3, undefined, '3'],
    [-0.00001, undefined, '0'],
    [1234.56789, undefined, '1234.5679'],
  ])('formatNumber(%s, %s) → %s', (value, digits, text) => {
    expect(formatNumber(value, digits)).toBe(text);
  });

  it('writes the sign of added terms', () => {
    expect(formatSigned(2.426)).toBe('+2.426');
    expect(formatSigned(-1)).toBe('−1');
    expect(formatSigned(0)).toBe('0');
  });

  it('writes percentages with one decimal', () => {
    expect(formatPercent(0.4567)).toBe('45.7 %');
    expect(formatPercent(1)).toBe('100 %');
  });
});

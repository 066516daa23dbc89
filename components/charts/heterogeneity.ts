import { formatNumber } from '@/lib/scoring/format';

/**
 * Heterogeneity in words for coaches. The I² bands follow the rough guide of Higgins et al.
 * (2003, BMJ 327:557–560: 25 % low, 50 % moderate, 75 % high); the wording is ours.
 */
export function describeI2(i2: number): string {
  const value = `I² ${formatNumber(i2, 0)} %`;
  if (i2 < 25)
    return `${value}: little of the spread between studies goes beyond what chance alone would produce; they tell a consistent story.`;
  if (i2 < 50)
    return `${value}: some of the spread is real differences between studies, but much of it could be chance.`;
  if (i2 < 75)
    return `${value}: most of the spread is real differences between studies (people, protocols, measures), not chance.`;
  return `${value}: nearly all of the spread is real differences between studies; one pooled number hides a lot of variety.`;
}

export function describeTau2(tau2: number, measureWords: string): string {
  if (tau2 <= 0) return 'τ² 0: no variation of the true effect between studies was estimated beyond chance.';
  const tau = Math.sqrt(tau2);
  return (
    `τ² ${formatNumber(tau2, 3)} (τ ${formatNumber(tau, 2)}): the true effect itself differs from study to study, ` +
    `with a standard deviation of about ${formatNumber(tau, 2)} on the ${measureWords} scale.`
  );
}

export const MEASURE_WORDS: Record<string, { axis: string; words: string }> = {
  smd: { axis: 'Standardized mean difference (Hedges’ g)', words: 'standardized mean difference' },
  'log-risk-ratio': { axis: 'Log risk ratio', words: 'log risk ratio' },
  'log-odds-ratio': { axis: 'Log odds ratio', words: 'log odds ratio' },
};

export const measureWords = (measure: string) => MEASURE_WORDS[measure] ?? { axis: measure, words: measure };

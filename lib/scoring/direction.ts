import { ScoringInputError } from './errors';

/**
 * Effects and the direction of an appraisal (docs/scoring.md §10).
 *
 * A study's effect size and the coach's "supports / against / neutral" must not contradict each
 * other silently. Every target (the claimed outcome, each mechanism) records which way its
 * measure is desirable; an effect is oriented so that a positive value is always the claimed
 * benefit, and the direction the effect suggests is read off its 95 % interval.
 */

/** Which way a target's measure is desirable: a pain score, an injury rate or time lost are 'lower'. */
export const DESIRABLE_DIRECTIONS = ['higher', 'lower'] as const;
export type Desirable = (typeof DESIRABLE_DIRECTIONS)[number];

export type SuggestedDirection = 'supports' | 'against' | 'neutral';

/** z for a two-sided 95 % interval, Φ⁻¹(0.975) (any statistics handbook's normal table). */
const Z95 = 1.959964;

/** y for 'higher', −y for 'lower': a positive oriented effect is always the claimed benefit. */
export function orientEffect(y: number, desirable: Desirable = 'higher'): number {
  if (desirable !== 'higher' && desirable !== 'lower') {
    throw new ScoringInputError('desirable', `must be 'higher' or 'lower', got ${String(desirable)}`);
  }
  return desirable === 'lower' ? -y : y;
}

/**
 * The direction a study's effect on a target suggests: 'supports' when the oriented 95 % interval
 * lies above 0, 'against' when it lies below, 'neutral' when it spans 0.
 *
 * @example
 * suggestDirection({ y: -0.25, v: 0.04, desirable: 'lower' }); // 'neutral' (0.25 ± 0.392)
 */
export function suggestDirection(input: { y: number; v: number; desirable?: Desirable }): SuggestedDirection {
  const { y, v, desirable = 'higher' } = input;
  if (!Number.isFinite(y)) throw new ScoringInputError('y', `the effect size must be a finite number, got ${y}`);
  if (!Number.isFinite(v) || v <= 0)
    throw new ScoringInputError('v', `the variance must be above 0 and finite, got ${v}`);
  const oriented = orientEffect(y, desirable);
  const half = Z95 * Math.sqrt(v);
  if (oriented - half > 0) return 'supports';
  if (oriented + half < 0) return 'against';
  return 'neutral';
}

/** The direction of a pooled, already oriented, random-effects result, from its interval. */
export function pooledDirection(pooled: { ciLow: number; ciHigh: number }): SuggestedDirection {
  if (pooled.ciLow > 0) return 'supports';
  if (pooled.ciHigh < 0) return 'against';
  return 'neutral';
}

/**
 * True when the pooled effect and the outcome probability disagree: an interval spanning 0 with
 * P ≥ 0.66, an interval below 0 with P ≥ 0.33, or an interval above 0 with P < 0.33.
 */
export function effectConflict(input: {
  pooled: { estimate: number; ciLow: number; ciHigh: number };
  outcomeProbability: number;
}): boolean {
  const { pooled, outcomeProbability: p } = input;
  for (const [field, value] of Object.entries({ ...pooled, outcomeProbability: p })) {
    if (!Number.isFinite(value)) throw new ScoringInputError(field, `must be a finite number, got ${value}`);
  }
  if (p < 0 || p > 1) throw new ScoringInputError('outcomeProbability', `must be 0 to 1, got ${p}`);
  const direction = pooledDirection(pooled);
  if (direction === 'neutral') return p >= 0.66;
  if (direction === 'against') return p >= 0.33;
  return p < 0.33;
}

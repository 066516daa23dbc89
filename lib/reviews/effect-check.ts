import { effectConflict, pooledDirection, type Desirable, type SuggestedDirection } from '@/lib/scoring/direction';
import { metaAnalyze } from './meta';
import type { ReviewData } from './verdict';
import type { EffectMeasure } from './types';

/** The claimed outcome's pooled effect beside its probability (docs/scoring.md §10). */
export interface EffectCheckDTO {
  /** Random-effects estimate and 95 % interval, oriented: positive = the claimed benefit. */
  pooled: { estimate: number; ciLow: number; ciHigh: number };
  k: number;
  measure: EffectMeasure;
  desirable: Desirable;
  direction: SuggestedDirection;
  /** True when the pooled effect and the outcome probability disagree. */
  conflict: boolean;
}

/**
 * Pools the claimed outcome's effect sizes (random effects, oriented) and says whether they
 * disagree with the outcome probability the model gives; null with fewer than two effect sizes.
 */
export function outcomeEffectCheck(data: ReviewData, outcomeProbability: number): EffectCheckDTO | null {
  const result = metaAnalyze({
    mechanism: null,
    appraisals: data.appraisals,
    studies: data.studies,
    outcomeDesirable: data.review.outcomeDesirable as Desirable,
  });
  if (!result.ok) return null;
  const { random, k, measure, desirable } = result.result;
  const pooled = { estimate: random.estimate, ciLow: random.ci[0], ciHigh: random.ci[1] };
  return {
    pooled,
    k,
    measure,
    desirable,
    direction: pooledDirection(pooled),
    conflict: effectConflict({ pooled, outcomeProbability }),
  };
}

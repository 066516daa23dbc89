import { suggestDirection, type Desirable, type SuggestedDirection } from '@/lib/scoring/direction';
import { comparableEffect } from './meta';
import type { EffectDataDTO } from './types';

/**
 * The direction a study's effect suggests for one target (docs/scoring.md §10), or null when the
 * study carries no usable effect data. Risk ratios and SMDs alike: both are 0 at "no effect" on
 * the scale pooled (log RR, d), so the same interval rule applies.
 */
export function suggestedDirectionFor(effect: unknown, desirable: Desirable): SuggestedDirection | null {
  if (!effect) return null;
  try {
    const comparable = comparableEffect(effect as EffectDataDTO);
    return suggestDirection({ y: comparable.effectSize, v: comparable.variance, desirable });
  } catch {
    // Data the statistics cannot use (e.g. both SDs 0): there is nothing to suggest.
    return null;
  }
}

/** A direction that differs from the suggested one needs a written reason: the issue, or null. */
export function directionReasonIssue(value: {
  direction: string;
  directionReason: string | null | undefined;
  suggested: SuggestedDirection | null;
}): { path: string; message: string } | null {
  if (value.suggested === null || value.suggested === value.direction) return null;
  if ((value.directionReason ?? '').trim().length >= 3) return null;
  return {
    path: 'directionReason',
    message: `The study’s effect suggests “${value.suggested}”: say why you chose “${value.direction}”.`,
  };
}

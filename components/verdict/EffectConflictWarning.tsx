import type { EffectCheckDTO } from '@/lib/reviews/effect-check';
import { formatNumber } from '@/lib/scoring/format';

const DIRECTION_WORDS: Record<EffectCheckDTO['direction'], string> = {
  supports: 'points to the claimed effect',
  against: 'points away from the claimed effect',
  neutral: 'spans no effect',
};

/**
 * Beside the outcome probability: a warning when the studies' pooled effect and the probability
 * disagree (docs/scoring.md §10), e.g. an interval spanning 0 under "90 % likely". The usual
 * cause is an appraisal's direction or a target's better direction entered the wrong way round.
 */
export function EffectConflictWarning({ check }: { check: EffectCheckDTO | null | undefined }) {
  if (!check?.conflict) return null;
  const n = (x: number) => formatNumber(x, 2);
  return (
    <div
      role="alert"
      data-testid="effect-conflict"
      className="border-warning-500 bg-warning-50 text-warning-800 flex gap-2 rounded-md border px-3 py-2 text-sm"
    >
      <svg viewBox="0 0 16 16" aria-hidden="true" className="mt-0.5 size-4 shrink-0">
        <path d="M8 1.5 15 14H1L8 1.5Z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
        <path d="M8 6v4M8 11.5v1" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
      </svg>
      <p>
        <strong>The pooled effect disagrees with this probability.</strong> The {check.k} studies with effect sizes pool
        to {n(check.pooled.estimate)} [{n(check.pooled.ciLow)}, {n(check.pooled.ciHigh)}], which{' '}
        {DIRECTION_WORDS[check.direction]}. Check each appraisal’s direction and which way the claimed outcome is
        better.
      </p>
    </div>
  );
}

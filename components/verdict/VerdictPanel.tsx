'use client';

import { Button } from '@/components/ui/Button';
import { cn } from '@/components/ui/cn';
import { SafetyNotice } from '@/components/ui/SafetyNotice';
import { Skeleton } from '@/components/ui/Skeleton';
import { percent } from '@/components/review/labels';
import type { MechanismDTO, VerdictKey } from '@/lib/reviews/types';
import { formatNumber } from '@/lib/scoring/format';
import { MIN_EVIDENCE_WEIGHT } from '@/lib/scoring/constants';
import { useVerdict } from '@/lib/swr/use-verdict';
import { EffectConflictWarning } from './EffectConflictWarning';
import { LikelihoodScale } from './LikelihoodScale';
import { VerdictChip } from './VerdictChip';
import { RobustnessPanel } from './RobustnessPanel';

/** What each verdict means, in a sentence a coach can repeat to an athlete. */
const VERDICT_MEANING: Record<VerdictKey, string> = {
  insufficient: `Too little appraised evidence to call it yet (evidence weight below ${MIN_EVIDENCE_WEIGHT}). Appraise more studies.`,
  'not-supported': 'The evidence makes the claimed outcome unlikely.',
  uncertain: 'The evidence leaves the claimed outcome open either way.',
  supported: 'The claimed outcome is likely, and so is the reason the claim gives for it.',
  'other-reasons': 'The claimed outcome is likely, but not for the reason the claim gives.',
};

/**
 * The live verdict beside the editor: fed by GET /api/reviews/:id/verdict and refreshed after
 * every change to mechanisms and appraisals. Every number opens into the engine's own working.
 */
export function VerdictPanel({ reviewId, mechanisms }: { reviewId: number; mechanisms: readonly MechanismDTO[] }) {
  const { data, error, isValidating, mutate } = useVerdict(reviewId);
  // The verdict names each mechanism; the workbench's list is the fallback while a rename is in flight.
  const names = new Map(mechanisms.map((m) => [m.id, m.name]));

  return (
    <section
      aria-labelledby="verdict-title"
      aria-busy={isValidating || undefined}
      data-testid="verdict-panel"
      className="border-line bg-paper-raised shadow-card rounded-lg border"
    >
      <div className="border-line flex items-center justify-between gap-2 border-b px-5 py-3">
        <h2 id="verdict-title" className="text-lg font-semibold">
          Verdict
        </h2>
        <span className="text-ink-muted text-xs" aria-live="polite">
          {isValidating && data ? 'Updating…' : ''}
        </span>
      </div>

      {error && !data ? (
        <div role="alert" className="space-y-3 px-5 py-5 text-sm">
          <p className="text-danger-800">The verdict could not be computed: {error.message}</p>
          <Button size="sm" variant="secondary" onClick={() => void mutate()}>
            Try again
          </Button>
        </div>
      ) : !data ? (
        <div className="space-y-3 px-5 py-5" aria-label="Loading the verdict">
          <Skeleton className="h-7 w-2/3" />
          <Skeleton className="h-4 w-full" />
          <Skeleton className="h-16 w-full" />
          <Skeleton className="h-24 w-full" />
        </div>
      ) : (
        <div className="space-y-5 px-5 py-5">
          <div className="space-y-2">
            <p className="text-ink-muted text-xs font-semibold tracking-wide uppercase">The claim</p>
            <p
              className="font-display text-2xl leading-tight font-semibold"
              data-testid="verdict-label"
              data-verdict={data.verdict}
            >
              {data.label}
            </p>
            <VerdictChip
              verdict={data.verdict}
              label={data.verdict === 'insufficient' ? 'Provisional' : 'Current reading'}
            />
            <p className="text-ink-muted text-sm">{VERDICT_MEANING[data.verdict]}</p>
          </div>

          <div className="space-y-2">
            <p className="text-sm font-semibold">Claimed outcome</p>
            <p className="flex items-baseline gap-2">
              <span className="text-2xl font-semibold tabular-nums" data-testid="outcome-probability">
                {percent(data.outcome.probability)}
              </span>
              <span className="text-ink-muted">{data.outcome.term}</span>
            </p>
            <LikelihoodScale probability={data.outcome.probability} />
            <EffectConflictWarning check={data.effectCheck} />
          </div>

          <div className="space-y-1">
            <p className="text-sm font-semibold">Evidence weight</p>
            <p className="flex items-baseline gap-2">
              <span className="text-lg font-semibold tabular-nums" data-testid="evidence-weight">
                {formatNumber(data.evidenceWeight, 2)}
              </span>
              <span className="text-ink-muted text-sm">
                {data.evidenceWeight < MIN_EVIDENCE_WEIGHT
                  ? `below the ${MIN_EVIDENCE_WEIGHT} a verdict needs`
                  : `at least the ${MIN_EVIDENCE_WEIGHT} a verdict needs`}
              </span>
            </p>
            <p className="text-ink-muted text-xs">
              Each appraisal adds its certainty weight × applicability; one fully applicable high-certainty study adds
              1.
            </p>
          </div>

          <div className="space-y-2">
            <p className="text-sm font-semibold" id="ranked-title">
              Mechanisms, by share of the explained effect
            </p>
            {data.mechanisms.length === 0 ? (
              <p className="text-ink-muted text-sm">No mechanisms yet. Add one from the editor’s toolbar.</p>
            ) : (
              <ol aria-labelledby="ranked-title" className="space-y-3" data-testid="ranked-mechanisms">
                {data.mechanisms.map((m) => (
                  <li key={m.id} className="space-y-1">
                    <div className="flex items-baseline justify-between gap-2 text-sm">
                      <span className="min-w-0 font-semibold">
                        <span className="text-ink-muted mr-1 tabular-nums">{m.rank}.</span>
                        {m.name || names.get(m.id)}
                        {m.stated && (
                          <span className="text-rope-700 ml-1.5 text-xs font-semibold">named by the claim</span>
                        )}
                      </span>
                      <span className="shrink-0 tabular-nums">{percent(m.share)}</span>
                    </div>
                    <div className="bg-chalk-200 h-2 overflow-hidden rounded-full" aria-hidden="true">
                      <div
                        className={cn('h-full rounded-full', m.stated ? 'bg-rope-500' : 'bg-granite-500')}
                        style={{ width: `${Math.max(0, Math.min(1, m.share)) * 100}%` }}
                      />
                    </div>
                    <p className="text-ink-muted text-xs">
                      {percent(m.probability)} · {m.term}
                      {m.dosePenalty > 0 && ' · the protocol falls short of its dose'}
                    </p>
                  </li>
                ))}
              </ol>
            )}
          </div>

          {data.robustness && <RobustnessPanel verdict={data} />}

          <details className="group border-line bg-paper-sunken/60 rounded-md border" data-testid="verdict-working">
            <summary className="text-brand cursor-pointer list-none px-3 py-2.5 text-sm font-semibold marker:hidden">
              <span aria-hidden="true" className="mr-1.5 inline-block transition-transform group-open:rotate-90">
                ▸
              </span>
              How this was computed
            </summary>
            <div className="border-line space-y-4 border-t px-3 py-3 text-sm">
              <ol className="list-decimal space-y-1.5 pl-5">
                {data.steps.map((step, i) => (
                  <li key={`${step.kind}-${i}`}>{step.text}</li>
                ))}
              </ol>
              <div className="space-y-1.5">
                <p className="font-semibold">The claimed outcome</p>
                <ol className="text-ink-muted list-decimal space-y-1 pl-5">
                  {data.outcome.steps.map((step, i) => (
                    <li key={`o-${i}`}>{step.text}</li>
                  ))}
                </ol>
              </div>
              {data.mechanisms.map((m) => (
                <div key={m.id} className="space-y-1.5">
                  <p className="font-semibold">{m.name || names.get(m.id)}</p>
                  <ol className="text-ink-muted list-decimal space-y-1 pl-5">
                    {m.steps.map((step, i) => (
                      <li key={`${m.id}-${i}`}>{step.text}</li>
                    ))}
                  </ol>
                </div>
              ))}
            </div>
          </details>

          <SafetyNotice />
        </div>
      )}
    </section>
  );
}

import type { VerdictDTO } from '@/lib/reviews/types';
import { LeaveOneOutChart } from './LeaveOneOutChart';
import { robustnessWords } from './robustness-words';

const FRAGILITY_WORDS = {
  1: 'One study can change it.',
  2: 'No single study changes it; two together can.',
  none: 'No single study, and no pair, changes it.',
} as const;

/**
 * "How solid is this?": what the verdict hangs on (docs/scoring.md §9) — the studies it cannot
 * lose, the prior bounds, the certainty calls that decide it — and the leave-one-out chart.
 * Shown inside the verdict panel, so it is as blind as every other engine number.
 */
export function RobustnessPanel({ verdict }: { verdict: VerdictDTO }) {
  const r = verdict.robustness;
  const words = robustnessWords(r, verdict.verdict, verdict.mechanisms);
  return (
    <section aria-labelledby="robustness-title" className="space-y-3" data-testid="robustness">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id="robustness-title" className="text-sm font-semibold">
          How solid is this?
        </h3>
        {verdict.verdict !== 'insufficient' && r.leaveOneOut.length > 0 && (
          <span className="text-ink-muted text-xs" data-testid="fragility">
            {FRAGILITY_WORDS[r.fragility ?? 'none']}
          </span>
        )}
      </div>
      <div className="text-sm" data-testid="robustness-sentence">
        <p>{words.lead}</p>
        {words.conditions.length > 0 && (
          <ul className="mt-1 list-disc space-y-0.5 pl-5">
            {words.conditions.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        )}
      </div>
      {r.leaveOneOut.length > 0 ? (
        <LeaveOneOutChart
          rows={r.leaveOneOut}
          outcomeProbability={verdict.outcome.probability}
          verdict={verdict.verdict}
        />
      ) : (
        <p className="text-ink-muted text-sm">No appraised studies yet: the chart appears with the first appraisal.</p>
      )}
      {words.priors.length > 0 && (
        <div className="space-y-1">
          <p className="text-xs font-semibold">Mechanism priors</p>
          <ul className="text-ink-muted space-y-0.5 text-xs">
            {words.priors.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        </div>
      )}
    </section>
  );
}

import { cn } from '@/components/ui/cn';
import { CERTAINTY_LABEL } from '@/components/review/labels';
import { CERTAINTY_STEP_LABEL } from '@/lib/scoring/appraisal-vocabulary';
import type { CertaintyResult } from '@/lib/scoring/certainty';

const signed = (n: number) => (n > 0 ? `+${n}` : n < 0 ? `−${Math.abs(n)}` : '0');

/** The certainty of an appraisal with each step that led to it, as the grading function reports it. */
export function CertaintyWorking({ result }: { result: CertaintyResult }) {
  return (
    <div className="space-y-2">
      <p className="flex flex-wrap items-baseline gap-x-2">
        <span className="text-ink-muted text-sm">Certainty</span>
        <span className="text-xl font-semibold" data-testid="certainty-level">
          {CERTAINTY_LABEL[result.level]}
        </span>
        <span className="text-ink-muted text-sm">({result.score} of 4)</span>
      </p>
      {/* Four cells, filled up to the score: a quick read that does not rely on colour alone. */}
      <div className="flex gap-1" aria-hidden="true">
        {[1, 2, 3, 4].map((n) => (
          <span
            key={n}
            className={cn('h-1.5 flex-1 rounded-full', n <= result.score ? 'bg-granite-600' : 'bg-chalk-200')}
          />
        ))}
      </div>
      <ol className="space-y-1 text-sm">
        {result.steps.map((step, i) => (
          <li key={`${step.domain}-${i}`} className="flex gap-2">
            <span className="w-28 shrink-0 font-semibold">
              {CERTAINTY_STEP_LABEL[step.domain] ?? step.domain}{' '}
              <span className="text-ink-muted font-normal tabular-nums">
                {step.domain === 'design' ? step.change : signed(step.change)}
              </span>
            </span>
            <span className="text-ink-muted">{step.reason}</span>
          </li>
        ))}
      </ol>
      {result.notes.map((note) => (
        <p key={note} className="bg-warning-50 text-warning-800 rounded-md px-3 py-2 text-sm">
          {note}
        </p>
      ))}
    </div>
  );
}

import { cn } from './cn';

/** The cautions every verdict and recommendation carries (docs/architecture.md, "The roles"), worded once. */
export const SAFETY_LINE =
  'Loadbearing is education, not a diagnosis or treatment plan. Stop on pain and see a licensed clinician (physiotherapist, sports physician). Defer to local professional regulation.';

/**
 * `compact` is the one-line form for footers; the full form sits beside verdicts and
 * recommendations, where someone is about to act on what they read.
 */
export function SafetyNotice({ compact = false, className }: { compact?: boolean; className?: string }) {
  if (compact) {
    return <p className={cn('text-ink-muted text-sm', className)}>{SAFETY_LINE}</p>;
  }
  return (
    <aside
      aria-label="Safety"
      className={cn(
        'border-warning-100 bg-warning-50 text-warning-800 flex gap-3 rounded-lg border px-4 py-3.5 text-sm',
        className,
      )}
    >
      <svg viewBox="0 0 20 20" className="mt-0.5 size-5 shrink-0" aria-hidden="true">
        <path d="M10 2.5 18 17H2L10 2.5Z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
        <path d="M10 8v4M10 14.5v.2" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
      </svg>
      <div className="space-y-1">
        <p className="font-semibold">Before anyone tries a protocol</p>
        <ul className="list-disc space-y-0.5 pl-4">
          <li>This is education, not a diagnosis or treatment plan.</li>
          <li>Stop on pain and see a licensed clinician (physiotherapist, sports physician).</li>
          <li>Defer to local professional regulation.</li>
        </ul>
      </div>
    </aside>
  );
}

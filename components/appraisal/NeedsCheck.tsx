/**
 * Appraisals saved before each certainty domain had its own column held the publication-bias
 * answer in all five domains. They stay flagged until a coach checks them and saves again
 * (README, "Upgrading").
 */

const TEXT = 'Saved before a fix: all five certainty domains may hold the publication-bias answer.';

/** A small flag beside the appraisal in the table. */
export function NeedsCheckFlag() {
  return (
    <span
      className="border-warning-500 bg-warning-50 text-warning-800 inline-flex items-center gap-1 rounded-sm border px-1.5 py-0.5 text-xs font-semibold"
      title={TEXT}
      data-testid="needs-check"
    >
      <svg viewBox="0 0 16 16" aria-hidden="true" className="size-3.5">
        <path d="M8 1.5 15 14H1L8 1.5Z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
        <path d="M8 6v4M8 11.5v1" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
      </svg>
      Check and save
      <span className="sr-only">: {TEXT}</span>
    </span>
  );
}

/** The notice at the top of the appraisal form. */
export function NeedsCheckNotice() {
  return (
    <p
      role="status"
      className="border-warning-500 bg-warning-50 text-warning-800 rounded-md border px-4 py-3 text-sm"
      data-testid="needs-check-notice"
    >
      {TEXT} Check each domain against the paper, then save: saving clears this flag.
    </p>
  );
}

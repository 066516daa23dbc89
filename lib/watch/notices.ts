/**
 * The kinds of update notice the watch acts on, in one list. The type names are the registry's
 * (Crossref metadata, the `update-to` / `updated-by` relations' `type`; the list from memory of
 * the Crossref "Crossmark update types": retraction, partial_retraction, withdrawal, removal,
 * expression_of_concern, correction, erratum, corrigendum). `severity` orders them: a study shows
 * its most serious notice. `past` finishes "a cited study was … on <date>".
 */
export const NOTICE_KINDS = {
  retraction: { label: 'Retracted', past: 'retracted', severity: 4 },
  withdrawal: { label: 'Withdrawn', past: 'withdrawn', severity: 4 },
  removal: { label: 'Removed', past: 'removed', severity: 4 },
  partial_retraction: { label: 'Partly retracted', past: 'partly retracted', severity: 3 },
  expression_of_concern: { label: 'Expression of concern', past: 'placed under an expression of concern', severity: 2 },
  correction: { label: 'Corrected', past: 'corrected', severity: 1 },
  erratum: { label: 'Corrected', past: 'corrected', severity: 1 },
  corrigendum: { label: 'Corrected', past: 'corrected', severity: 1 },
} as const;

export type NoticeKind = keyof typeof NOTICE_KINDS;

export function isNoticeKind(type: string): type is NoticeKind {
  return Object.hasOwn(NOTICE_KINDS, type);
}

/** One update notice about a study: its kind, the notice's own DOI and its date (YYYY-MM-DD, or null when unknown). */
export interface EvidenceNotice {
  kind: NoticeKind;
  noticeDoi: string;
  date: string | null;
}

/** The notice a study shows: the most serious, then the latest. */
export function headlineNotice(notices: readonly EvidenceNotice[]): EvidenceNotice | null {
  let best: EvidenceNotice | null = null;
  for (const n of notices) {
    if (
      !best ||
      NOTICE_KINDS[n.kind].severity > NOTICE_KINDS[best.kind].severity ||
      (NOTICE_KINDS[n.kind].severity === NOTICE_KINDS[best.kind].severity && (n.date ?? '') > (best.date ?? ''))
    )
      best = n;
  }
  return best;
}

/** "Retracted 20 Nov 2026 (notice 10.5555/…)" — the short line of a badge's title and the library row. */
export function noticeLine(n: EvidenceNotice): string {
  const when = n.date ? ` ${formatNoticeDate(n.date)}` : '';
  return `${NOTICE_KINDS[n.kind].label}${when} (notice doi:${n.noticeDoi})`;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "2026-11-20" → "20 Nov 2026"; a year-month date → "Nov 2026". Fixed words, so server and client agree. */
export function formatNoticeDate(date: string): string {
  const [y, m, d] = date.split('-').map(Number);
  if (!m) return String(y);
  return d ? `${d} ${MONTHS[m - 1]} ${y}` : `${MONTHS[m - 1]} ${y}`;
}

import { LIKELIHOOD_BANDS } from '@/lib/scoring/likelihood';

/** The seven likelihood terms in band order (0 … 6), as the reviewer reads them. */
export const BAND_TERMS = LIKELIHOOD_BANDS.map((b) => b.term);

/** "likely (66–90 %)": a band with the probabilities it covers. */
export function bandRange(index: number): string {
  const b = LIKELIHOOD_BANDS[index];
  const pct = (x: number) => `${Math.round(x * 100)}`;
  if (index === 0) return `below ${pct(b.max)} %`;
  if (index === LIKELIHOOD_BANDS.length - 1) return `${pct(b.min)} % or more`;
  return `${pct(b.min)}–${pct(b.max)} %`;
}

const capitalize = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
export const bandLabel = (index: number) => capitalize(BAND_TERMS[index]);

export const AUDIT_LABEL: Record<string, string> = {
  'round.opened': 'opened the round',
  'round.scorecard_submitted': 'submitted a scorecard',
  'round.signoff_changed': 'changed their sign-off',
  'round.resolution_recorded': 'recorded a resolution',
  'round.comment_posted': 'commented',
  'round.comment_resolved': 'resolved or reopened a thread',
  'round.reminder_sent': 'sent the 24-hour reminder',
  'round.closed_without': 'closed without a reviewer',
  'round.closed': 'closed the round',
};

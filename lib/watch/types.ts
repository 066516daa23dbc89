import type { VerdictKey } from '@/lib/reviews/types';
import type { EvidenceNotice } from './notices';

/** What the evidence watch's routes and pages send (docs/api/publishing.md, "Evidence watch"). */

/** The verdict as it would be without one study: the leave-one-out row of docs/scoring.md §9. */
export interface DryRunDTO {
  studyId: number;
  verdict: VerdictKey;
  verdictLabel: string;
  outcomeProbability: number;
  /** The review's verdict now, with the study. */
  currentVerdict: VerdictKey;
  currentLabel: string;
  changed: boolean;
}

export interface EvidenceFlagDTO {
  id: number;
  slug: string;
  title: string;
  versionNumber: number;
  study: { id: number; citation: string; doi: string | null };
  notice: EvidenceNotice;
  reason: string;
  /** Null for readers who may not see engine numbers (`evidence.dryrun.read`). */
  dryRun: DryRunDTO | null;
  /** The dry run in a sentence ("Without it the verdict would …"). */
  dryRunText: string | null;
  flaggedAt: string;
}

export interface WatchSummaryDTO {
  /** DOIs asked of the registry in this run (the rest were fresh in the cache). */
  asked: number;
  /** DOIs answered from the cache (checked recently). */
  cached: number;
  notFound: number;
  /** Studies that received a notice they did not carry before. */
  newNotices: { studyId: number; citation: string; notice: EvidenceNotice }[];
  flagged: { slug: string; title: string; studyId: number }[];
  mailed: number;
  suggestions: number;
  /** Waits the registry asked for (429 + Retry-After). */
  backoffs: number;
}

export interface WatchRunDTO {
  id: number;
  teamId: number | null;
  trigger: string;
  status: 'running' | 'done' | 'failed';
  total: number;
  checked: number;
  error: string | null;
  summary: WatchSummaryDTO | null;
  startedAt: string;
  finishedAt: string | null;
}

export interface SuggestionDTO {
  id: number;
  slug: string;
  verdictTitle: string;
  mechanism: string;
  study: { id: number; citation: string; title: string };
  reason: string;
  createdAt: string;
}

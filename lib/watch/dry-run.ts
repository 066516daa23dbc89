import { loadReviewData, scoreReviewData } from '@/lib/reviews/verdict';
import { VERDICT_LABEL } from '@/lib/scoring/constants';
import { robustness } from '@/lib/scoring/robustness';
import type { DryRunDTO } from './types';

/**
 * What the review's verdict would become without one study: its leave-one-study-out row
 * (docs/scoring.md §9, lib/scoring/robustness.ts) — every appraisal of that study dropped from
 * the outcome and from every mechanism, everything else held. Read-only: nothing is changed;
 * the team decides what to publish. Null when the review is gone or no appraisal uses the study.
 */
export async function dryRunWithout(reviewId: number, studyId: number): Promise<DryRunDTO | null> {
  const data = await loadReviewData(reviewId);
  if (!data) return null;
  const { input, score } = scoreReviewData(data);
  const row = robustness(input).leaveOneOut.find((r) => r.studyId === String(studyId));
  if (!row) return null;
  return {
    studyId,
    verdict: row.verdict,
    verdictLabel: VERDICT_LABEL[row.verdict],
    outcomeProbability: row.outcomeProbability,
    currentVerdict: score.verdict,
    currentLabel: VERDICT_LABEL[score.verdict],
    changed: row.changed,
  };
}

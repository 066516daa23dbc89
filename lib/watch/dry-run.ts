import { loadReviewData, scoreReviewData } from '@/lib/reviews/verdict';
import { VERDICT_LABEL } from '@/lib/scoring/constants';
import type { DryRunDTO } from './types';

/**
 * What the review's verdict would become without one study: every appraisal of that study
 * dropped from the outcome and from every mechanism, everything else held — the leave-one-out
 * row of docs/scoring.md §9. Read-only: nothing is changed; the team decides what to publish.
 * Null when the review is gone or never cited the study in an appraisal.
 */
export async function dryRunWithout(reviewId: number, studyId: number): Promise<DryRunDTO | null> {
  const data = await loadReviewData(reviewId);
  if (!data || !data.appraisals.some((a) => a.studyId === studyId)) return null;
  const now = scoreReviewData(data).score;
  const without = scoreReviewData({ ...data, appraisals: data.appraisals.filter((a) => a.studyId !== studyId) }).score;
  return {
    studyId,
    verdict: without.verdict,
    verdictLabel: VERDICT_LABEL[without.verdict],
    outcomeProbability: without.outcome.probability,
    currentVerdict: now.verdict,
    currentLabel: VERDICT_LABEL[now.verdict],
    changed: without.verdict !== now.verdict,
  };
}

'use client';

import useSWR from 'swr';
import { fetcher } from './fetcher';
import { useFirstViewOptions } from './first-view';
import type { AgreementDTO, CandidateDTO, CommentDTO, RoundAuditDTO, RoundDTO } from '@/lib/rounds/types';
import type { ApiError } from './fetcher';

/** swr hooks of peer review: one per resource, keyed by the route they read. */

export type RoundList = { rounds: RoundDTO[]; candidates?: CandidateDTO[]; audit?: RoundAuditDTO[] };

export const roundsKey = (reviewId: number) => `/api/reviews/${reviewId}/rounds`;
export const agreementKey = (reviewId: number, roundId: number) =>
  `/api/reviews/${reviewId}/rounds/${roundId}/agreement`;
export const commentsKey = (reviewId: number, roundId: number) =>
  `/api/reviews/${reviewId}/comments?roundId=${roundId}`;

export function useRounds(reviewId: number, fallbackData?: RoundList) {
  const key = roundsKey(reviewId);
  const firstView = useFirstViewOptions(key, fallbackData);
  return useSWR<RoundList, ApiError>(key, fetcher, { fallbackData, ...firstView });
}

export function useAgreement(reviewId: number, roundId: number | null) {
  return useSWR<AgreementDTO, ApiError>(roundId ? agreementKey(reviewId, roundId) : null, fetcher);
}

export function useComments(reviewId: number, roundId: number | null) {
  return useSWR<{ roundId: number | null; comments: CommentDTO[] }, ApiError>(
    roundId ? commentsKey(reviewId, roundId) : null,
    fetcher,
  );
}

/** True while the review has an open round (its text, mechanisms and appraisals are frozen). */
export function useReviewFrozen(reviewId: number): boolean {
  const { data } = useRounds(reviewId);
  // Invited reviewers and managers see the open round; anyone else cannot edit the review anyway.
  return Boolean(data?.rounds.some((r) => r.status === 'open'));
}

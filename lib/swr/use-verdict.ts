'use client';

import useSWR from 'swr';
import type { VerdictDTO } from '@/lib/reviews/types';
import { fetcher, type ApiError } from './fetcher';
import { keys } from './keys';

/** GET /api/reviews/:id/verdict — the scoring engine's whole output, the dose check and each appraisal's working. */
export function useVerdict(reviewId: number) {
  return useSWR<VerdictDTO, ApiError>(keys.verdict(reviewId), fetcher, { keepPreviousData: true });
}

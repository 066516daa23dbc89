'use client';

import useSWR from 'swr';
import type { VerdictDTO } from '@/lib/reviews/types';
import { fetcher, type ApiError } from './fetcher';
import { useFirstViewOptions } from './first-view';
import { keys } from './keys';

/** GET /api/reviews/:id/verdict — the scoring engine's whole output, the dose check and each appraisal's working. */
export function useVerdict(reviewId: number) {
  const key = keys.verdict(reviewId);
  const firstView = useFirstViewOptions(key);
  return useSWR<VerdictDTO, ApiError>(key, fetcher, { keepPreviousData: true, ...firstView });
}

'use client';

import useSWR from 'swr';
import { fetcher, type ApiError } from './fetcher';
import { keys } from './keys';

/** GET /api/reviews/:id/publish — the review's publication state, in the shape the panel reads. */
export function usePublication<T>(reviewId: number) {
  return useSWR<T, ApiError>(keys.publication(reviewId), fetcher);
}

'use client';

import useSWR from 'swr';
import type { ReviewSummaryDTO } from '@/lib/reviews/types';
import { fetcher, type ApiError } from './fetcher';
import { keys } from './keys';

/** GET /api/reviews?teamId — the team's reviews; the table sorts and filters them in the browser. */
export function useReviews(teamId: number, fallbackData?: { reviews: ReviewSummaryDTO[] }) {
  return useSWR<{ reviews: ReviewSummaryDTO[] }, ApiError>(keys.reviews(teamId), fetcher, { fallbackData });
}

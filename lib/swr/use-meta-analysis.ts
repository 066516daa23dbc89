'use client';

import useSWR from 'swr';
import type { MetaAnalysisDTO } from '@/lib/reviews/types';
import { fetcher, type ApiError } from './fetcher';
import { keys, type MetaAnalysisTarget } from './keys';

/** GET /api/reviews/:id/meta-analysis?mechanism=<id>|outcome; `enabled` false skips it (nothing to pool). */
export function useMetaAnalysis(reviewId: number, target: MetaAnalysisTarget, enabled = true) {
  return useSWR<MetaAnalysisDTO, ApiError>(enabled ? keys.metaAnalysis(reviewId, target) : null, fetcher, {
    keepPreviousData: true,
  });
}

'use client';

import useSWR from 'swr';
import type { VerdictListItemDTO } from '@/lib/publishing/types';
import type { SearchResultDTO } from '@/lib/search/search';
import { fetcher, type ApiError } from './fetcher';
import { keys } from './keys';

/**
 * GET /api/search — reviews, mechanisms and studies like the words typed; null asks nothing.
 * The previous results stay on screen while the next ones load, so the list does not flicker.
 */
export function useSearch(params: URLSearchParams | null) {
  return useSWR<{ results: SearchResultDTO[] }, ApiError>(params ? keys.search(params) : null, fetcher, {
    keepPreviousData: true,
  });
}

/** GET /api/verdicts?q= — published verdicts like the words typed; an empty query asks nothing. */
export function useVerdictSearch(q: string, teamId?: number) {
  return useSWR<{ verdicts: VerdictListItemDTO[] }, ApiError>(q ? keys.verdictSearch(q, teamId) : null, fetcher, {
    keepPreviousData: true,
  });
}

'use client';

import useSWR from 'swr';
import type { WorkbenchDTO } from '@/lib/reviews/types';
import { fetcher, type ApiError } from './fetcher';
import { useFirstViewOptions } from './first-view';
import { keys } from './keys';

/** GET /api/reviews/:id — the review, its mechanisms, appraisals and the studies they cite. */
export function useWorkbench(reviewId: number, fallbackData?: WorkbenchDTO) {
  const key = keys.workbench(reviewId);
  const firstView = useFirstViewOptions(key, fallbackData);
  return useSWR<WorkbenchDTO, ApiError>(key, fetcher, {
    fallbackData,
    // The editor owns the body while someone types; refocusing the tab must not pull a newer
    // body under their cursor (the 409 flow decides what happens to a concurrent change).
    revalidateOnFocus: false,
    ...firstView,
  });
}

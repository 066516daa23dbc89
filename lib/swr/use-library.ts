'use client';

import useSWR from 'swr';
import type { StudyDTO } from '@/lib/reviews/types';
import { apiFetch, type ApiError } from './fetcher';
import { keys } from './keys';
import type { StudyListDTO } from '@/lib/reviews/types';

const PAGE_SIZE = 100;
/** A guard against a library so large that loading it whole would stall the page. */
const MAX_PAGES = 50;

/**
 * The whole team library, for pickers that search it in the browser (the citation picker and the
 * appraisal form). Pages through GET /api/studies; the key starts with /api/studies so adding
 * studies revalidates it with every other library view.
 */
export function useLibrary(teamId: number | null) {
  const key = teamId ? `${keys.studies({ teamId, sort: 'citation', pageSize: PAGE_SIZE })}&all=1` : null;
  return useSWR<StudyDTO[], ApiError>(
    key,
    async () => {
      const all: StudyDTO[] = [];
      for (let page = 1; page <= MAX_PAGES; page += 1) {
        const result = await apiFetch<StudyListDTO>(
          keys.studies({ teamId: teamId!, sort: 'citation', page, pageSize: PAGE_SIZE }),
        );
        all.push(...result.studies);
        if (result.studies.length === 0 || all.length >= result.total) break;
      }
      return all;
    },
    { revalidateOnFocus: false, keepPreviousData: true },
  );
}

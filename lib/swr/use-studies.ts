'use client';

import useSWR from 'swr';
import type { StudyListDTO } from '@/lib/reviews/types';
import { fetcher, type ApiError } from './fetcher';
import { keys, type StudyQuery } from './keys';

/** GET /api/studies — one page of the team's library; the server filters, sorts and pages. */
export function useStudies(q: StudyQuery | null) {
  return useSWR<StudyListDTO, ApiError>(q ? keys.studies(q) : null, fetcher, { keepPreviousData: true });
}

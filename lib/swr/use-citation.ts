'use client';

import useSWR from 'swr';
import type { CitationDTO } from '@/lib/reviews/types';
import { fetcher, type ApiError } from './fetcher';
import { keys } from './keys';

/** GET /api/studies/:id/citation — a study's reference in one format; `enabled` false asks nothing yet. */
export function useCitation(studyId: number, format: 'apa' | 'bibtex' | 'ris' | 'csl', enabled = true) {
  return useSWR<CitationDTO, ApiError>(enabled ? keys.citation(studyId, format) : null, fetcher);
}

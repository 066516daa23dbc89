'use client';

import useSWR from 'swr';
import type { StudyDetailDTO } from '@/lib/reviews/types';
import { fetcher, type ApiError } from './fetcher';
import { keys } from './keys';

/** GET /api/studies/:id — the study and its appraisals across the team's reviews. */
export function useStudy(studyId: number, fallbackData?: StudyDetailDTO) {
  return useSWR<StudyDetailDTO, ApiError>(keys.study(studyId), fetcher, { fallbackData });
}

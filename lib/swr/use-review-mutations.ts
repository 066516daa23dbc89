'use client';

import { useCallback, useMemo } from 'react';
import { useSWRConfig } from 'swr';
import type { AppraisalDTO, MechanismDTO, ReviewDTO } from '@/lib/reviews/types';
import type { AppraisalInput } from '@/lib/validation/appraisals';
import { apiFetch } from './fetcher';
import { isReviewKey, isReviewListKey } from './keys';

/** The mechanism fields a coach edits (POST and PATCH bodies). */
export type MechanismInput = Pick<
  MechanismDTO,
  'name' | 'kind' | 'summary' | 'minIntensity' | 'minEffort' | 'prior' | 'magnitude' | 'stated' | 'desirable'
>;

/**
 * Every write of the workbench except the body's autosave, each followed by a revalidation of
 * everything cached for the review — workbench, verdict and meta-analyses — so the verdict
 * panel shows the consequence of a change as soon as the server has it.
 */
export function useReviewMutations(reviewId: number) {
  const { mutate } = useSWRConfig();
  const base = `/api/reviews/${reviewId}`;

  const refresh = useCallback(async () => {
    await mutate(isReviewKey(reviewId));
  }, [mutate, reviewId]);

  const after = useCallback(
    async <T>(work: Promise<T>): Promise<T> => {
      const result = await work;
      void refresh();
      return result;
    },
    [refresh],
  );

  return useMemo(
    () => ({
      refresh,
      createMechanism: (input: MechanismInput) =>
        after(apiFetch<{ mechanism: MechanismDTO }>(`${base}/mechanisms`, { method: 'POST', json: input })).then(
          (r) => r.mechanism,
        ),
      updateMechanism: (id: number, input: Partial<MechanismInput> & { position?: number }) =>
        after(apiFetch<{ mechanism: MechanismDTO }>(`${base}/mechanisms/${id}`, { method: 'PATCH', json: input })).then(
          (r) => r.mechanism,
        ),
      deleteMechanism: (id: number) => after(apiFetch<unknown>(`${base}/mechanisms/${id}`, { method: 'DELETE' })),
      createAppraisal: (input: AppraisalInput) =>
        after(apiFetch<{ appraisal: AppraisalDTO }>(`${base}/appraisals`, { method: 'POST', json: input })).then(
          (r) => r.appraisal,
        ),
      updateAppraisal: (id: number, input: Partial<AppraisalInput>) =>
        after(apiFetch<{ appraisal: AppraisalDTO }>(`${base}/appraisals/${id}`, { method: 'PATCH', json: input })).then(
          (r) => r.appraisal,
        ),
      deleteAppraisal: (id: number) => after(apiFetch<unknown>(`${base}/appraisals/${id}`, { method: 'DELETE' })),
      /** PATCH with the version; a stale one throws ApiError 409 whose body carries `current`. */
      updateReview: (fields: Partial<ReviewDTO> & { version: number }) =>
        after(apiFetch<{ review: ReviewDTO }>(base, { method: 'PATCH', json: fields })).then((r) => {
          void mutate(isReviewListKey);
          return r.review;
        }),
    }),
    [after, base, mutate, refresh],
  );
}

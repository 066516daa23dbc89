import { assertReviewEditable } from '@/lib/rounds/freeze';
import { route } from '@/lib/auth/handler';
import { deleteAppraisal, updateAppraisal } from '@/lib/reviews/commands';
import { appraisalOf, reviewAccess, reviewRow } from '@/lib/reviews/queries';
import { appraisalParams, appraisalUpdateSchema } from '@/lib/validation/appraisals';

// PATCH /api/reviews/:id/appraisals/:appraisalId — any appraisal fields (author, owner) → { appraisal }.
export const PATCH = route(
  { params: appraisalParams, body: appraisalUpdateSchema },
  async ({ params, body, authorize }) => {
    authorize('review.update', await reviewAccess(params.id), 'That review');
    await assertReviewEditable(params.id);
    const appraisal = await appraisalOf(params.id, params.appraisalId);
    return { appraisal: await updateAppraisal(await reviewRow(params.id), appraisal, body) };
  },
);

// DELETE /api/reviews/:id/appraisals/:appraisalId — (author, owner) → { appraisal } as it was.
export const DELETE = route({ params: appraisalParams }, async ({ params, authorize }) => {
  authorize('review.update', await reviewAccess(params.id), 'That review');
  await assertReviewEditable(params.id);
  const appraisal = await appraisalOf(params.id, params.appraisalId);
  return { appraisal: await deleteAppraisal(await reviewRow(params.id), appraisal) };
});

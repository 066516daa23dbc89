import { onReviewChanged } from '@/lib/search/index-store';
import { assertReviewEditable } from '@/lib/rounds/freeze';
import { route } from '@/lib/auth/handler';
import { deleteMechanism, updateMechanism } from '@/lib/reviews/commands';
import { mechanismOf, reviewAccess } from '@/lib/reviews/queries';
import { mechanismParams, mechanismUpdateSchema } from '@/lib/validation/reviews';

// PATCH /api/reviews/:id/mechanisms/:mechanismId — any mechanism fields (author, owner) → { mechanism }.
export const PATCH = route(
  { params: mechanismParams, body: mechanismUpdateSchema },
  async ({ params, body, authorize }) => {
    authorize('review.update', await reviewAccess(params.id), 'That review');
    await assertReviewEditable(params.id);
    const mechanism = await updateMechanism(await mechanismOf(params.id, params.mechanismId), body);
    await onReviewChanged(params.id);
    return { mechanism };
  },
);

// DELETE /api/reviews/:id/mechanisms/:mechanismId — with its appraisals (author, owner) → { mechanism, deletedAppraisals }.
export const DELETE = route({ params: mechanismParams }, async ({ params, authorize }) => {
  authorize('review.update', await reviewAccess(params.id), 'That review');
  await assertReviewEditable(params.id);
  const deleted = await deleteMechanism(await mechanismOf(params.id, params.mechanismId));
  await onReviewChanged(params.id);
  return deleted;
});

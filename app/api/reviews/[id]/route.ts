import { onReviewChanged, onReviewSaved } from '@/lib/search/index-store';
import { assertReviewEditable, assertSeesScores } from '@/lib/rounds/freeze';
import { route } from '@/lib/auth/handler';
import { deleteReview, updateReview } from '@/lib/reviews/commands';
import { getReviewDTO, getWorkbench, reviewAccess } from '@/lib/reviews/queries';
import { reviewParams, updateReviewSchema } from '@/lib/validation/reviews';

// GET /api/reviews/:id — the workbench: review, mechanisms, appraisals, studies (staff of the team) → WorkbenchDTO.
export const GET = route({ params: reviewParams }, async ({ params, authorize, signedIn }) => {
  authorize('review.read', await reviewAccess(params.id), 'That review');
  // Blind scoring: an invited reviewer who has not submitted reads the round page, not the workbench.
  await assertSeesScores(signedIn().userId, params.id);
  return getWorkbench(params.id);
});

// PATCH /api/reviews/:id — any fields plus the `version` read (author, owner) → { review }; stale → 409 { error, current }.
export const PATCH = route(
  { params: reviewParams, body: updateReviewSchema },
  async ({ params, body, authorize, signedIn }) => {
    const access = await reviewAccess(params.id);
    authorize('review.update', access, 'That review');
    await assertReviewEditable(params.id);
    const outcome = await updateReview(params.id, signedIn().userId, body);
    if (outcome.ok) {
      await onReviewSaved(outcome.row);
      return { review: outcome.review };
    }
    const error = 'Someone else saved this review after you opened it. Reload it, or keep your text as a copy.';
    return Response.json({ error, current: outcome.current }, { status: 409 });
  },
);

// DELETE /api/reviews/:id — with its mechanisms and appraisals (author, owner) → { review } as it was.
export const DELETE = route({ params: reviewParams }, async ({ params, authorize, signedIn }) => {
  authorize('review.delete', await reviewAccess(params.id), 'That review');
  const review = await getReviewDTO(params.id);
  await deleteReview(params.id, signedIn().userId);
  await onReviewChanged(params.id);
  return { review };
});

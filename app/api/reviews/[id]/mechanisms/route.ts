import { onReviewChanged } from '@/lib/search/index-store';
import { assertReviewEditable } from '@/lib/rounds/freeze';
import { route } from '@/lib/auth/handler';
import { createMechanism } from '@/lib/reviews/commands';
import { reviewAccess } from '@/lib/reviews/queries';
import { mechanismSchema, reviewParams } from '@/lib/validation/reviews';

// POST /api/reviews/:id/mechanisms — adds a candidate mechanism (author, owner) → 201 { mechanism }.
export const POST = route({ params: reviewParams, body: mechanismSchema }, async ({ params, body, authorize }) => {
  authorize('review.update', await reviewAccess(params.id), 'That review');
  await assertReviewEditable(params.id);
  const mechanism = await createMechanism(params.id, body);
  await onReviewChanged(params.id);
  return Response.json({ mechanism }, { status: 201 });
});

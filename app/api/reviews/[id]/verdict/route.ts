import { route } from '@/lib/auth/handler';
import { reviewAccess } from '@/lib/reviews/queries';
import { reviewVerdict } from '@/lib/reviews/verdict';
import { reviewParams } from '@/lib/validation/reviews';

// GET /api/reviews/:id/verdict — the scoring engine's full output with its working, the dose check and each appraisal's certainty steps (staff) → VerdictDTO.
export const GET = route({ params: reviewParams }, async ({ params, authorize }) => {
  authorize('review.read', await reviewAccess(params.id), 'That review');
  return reviewVerdict(params.id);
});

import { assertSeesScores } from '@/lib/rounds/freeze';
import { route } from '@/lib/auth/handler';
import { reviewAccess } from '@/lib/reviews/queries';
import { reviewVerdict } from '@/lib/reviews/verdict';
import { reviewParams } from '@/lib/validation/reviews';

// GET /api/reviews/:id/verdict — the scoring engine's full output with its working, the dose check and each appraisal's certainty steps (staff) → VerdictDTO.
export const GET = route({ params: reviewParams }, async ({ params, authorize, signedIn }) => {
  authorize('review.read', await reviewAccess(params.id), 'That review');
  await assertSeesScores(signedIn().userId, params.id);
  return reviewVerdict(params.id);
});

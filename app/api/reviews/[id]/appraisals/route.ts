import { assertReviewEditable } from '@/lib/rounds/freeze';
import { route } from '@/lib/auth/handler';
import { createAppraisal } from '@/lib/reviews/commands';
import { reviewAccess, reviewRow } from '@/lib/reviews/queries';
import { appraisalSchema } from '@/lib/validation/appraisals';
import { reviewParams } from '@/lib/validation/reviews';

// POST /api/reviews/:id/appraisals — appraises a library study for a mechanism or (mechanismId null) the outcome (author, owner) → 201 { appraisal }.
export const POST = route({ params: reviewParams, body: appraisalSchema }, async ({ params, body, authorize }) => {
  authorize('review.update', await reviewAccess(params.id), 'That review');
  await assertReviewEditable(params.id);
  return Response.json({ appraisal: await createAppraisal(await reviewRow(params.id), body) }, { status: 201 });
});

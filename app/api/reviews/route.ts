import { onReviewChanged } from '@/lib/search/index-store';
import { withBlindVerdictsHidden } from '@/lib/rounds/freeze';
import { route } from '@/lib/auth/handler';
import { createReview } from '@/lib/reviews/commands';
import { listReviews } from '@/lib/reviews/queries';
import { createReviewSchema, reviewListQuery } from '@/lib/validation/reviews';

// GET /api/reviews — reviews of the caller's teams (staff), newest change first; ?teamId&status&verdict&tag → { reviews }.
export const GET = route({ query: reviewListQuery }, async ({ query, authorize, signedIn }) => {
  if (query.teamId !== undefined) authorize('review.list', { teamId: query.teamId }, 'That team');
  // Blind scoring: a reviewer still scoring a review does not see its verdict in the list either.
  return { reviews: await withBlindVerdictsHidden(signedIn().userId, await listReviews(signedIn(), query)) };
});

// POST /api/reviews — captures a claim, its protocol and population as a draft (owner, coach) → 201 { review }.
export const POST = route({ body: createReviewSchema }, async ({ body, authorize, signedIn }) => {
  authorize('review.create', { teamId: body.teamId }, 'That team');
  const review = await createReview(signedIn().userId, body);
  await onReviewChanged(review.id);
  return Response.json({ review }, { status: 201 });
});

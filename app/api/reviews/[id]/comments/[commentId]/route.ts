import { route } from '@/lib/auth/handler';
import { reviewRoundAccess } from '@/lib/rounds/access';
import { setCommentResolved } from '@/lib/rounds/commands';
import { commentParams, commentResolveSchema } from '@/lib/validation/rounds';

// PATCH /api/reviews/:id/comments/:commentId — `{ resolved }` marks a thread settled or reopens it (author, owner) → { comment }.
export const PATCH = route(
  { params: commentParams, body: commentResolveSchema },
  async ({ params, body, authorize, signedIn }) => {
    const access = await reviewRoundAccess(params.id, signedIn().userId);
    authorize('review.round.comment', access, 'That review');
    authorize('review.round.settle', access, 'That review');
    return { comment: await setCommentResolved(params.id, params.commentId, signedIn().userId, body.resolved) };
  },
);

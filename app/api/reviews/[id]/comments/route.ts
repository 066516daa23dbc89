import { conflict } from '@/lib/api/errors';
import { route } from '@/lib/auth/handler';
import { reviewRoundAccess } from '@/lib/rounds/access';
import { postComment } from '@/lib/rounds/commands';
import { listComments } from '@/lib/rounds/queries';
import { reviewParams } from '@/lib/validation/reviews';
import { commentSchema, commentsQuery } from '@/lib/validation/rounds';

// GET /api/reviews/:id/comments?roundId= — the threads of a round (default the latest) for its author, owner and invited reviewers → { roundId, comments }.
export const GET = route(
  { params: reviewParams, query: commentsQuery },
  async ({ params, query, authorize, signedIn }) => {
    const access = await reviewRoundAccess(params.id, signedIn().userId, query.roundId);
    authorize('review.round.comment', access, 'That review');
    if (!access.round) return { roundId: null, comments: [] };
    // Before submitting, an invited reviewer does not read the other reviewers' comments (blind scoring).
    const blind = access.invited && !access.submitted && access.round.status === 'open';
    return { roundId: access.round.id, comments: await listComments(params.id, access.round.id, signedIn(), blind) };
  },
);

// POST /api/reviews/:id/comments — `{ body, mechanismId?, parentId?, roundId? }` on an open round; a reply mails the thread's starter → 201 { comment, mailFailures }.
export const POST = route(
  { params: reviewParams, body: commentSchema },
  async ({ params, body, authorize, signedIn }) => {
    const access = await reviewRoundAccess(params.id, signedIn().userId, body.roundId);
    authorize('review.round.comment', access, 'That review');
    if (!access.round) throw conflict('Comments open with a peer-review round; this review has none yet.');
    const result = await postComment(params.id, access.round, signedIn().userId, body);
    return Response.json(result, { status: 201 });
  },
);

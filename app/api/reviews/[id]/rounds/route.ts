import { route } from '@/lib/auth/handler';
import { openRound } from '@/lib/rounds/commands';
import { listRounds, roundDTO } from '@/lib/rounds/queries';
import { reviewAccess } from '@/lib/reviews/queries';
import { reviewParams } from '@/lib/validation/reviews';
import { openRoundSchema } from '@/lib/validation/rounds';

// GET /api/reviews/:id/rounds — rounds the caller may see (author, owner: all, with candidates; owner also the audit log; invited reviewers: theirs) → { rounds, candidates?, audit? }.
export const GET = route({ params: reviewParams }, async ({ params, authorize, signedIn }) => {
  const access = await reviewAccess(params.id);
  authorize('review.read', access, 'That review');
  return listRounds(params.id, signedIn(), access);
});

// POST /api/reviews/:id/rounds — opens a round `{ reviewerIds, dueAt, note? }` (author, owner), mails each reviewer → 201 { round, mailFailures }.
export const POST = route(
  { params: reviewParams, body: openRoundSchema },
  async ({ params, body, authorize, signedIn }) => {
    const access = await reviewAccess(params.id);
    authorize('review.round.open', access, 'That review');
    const { round, mailFailures } = await openRound(params.id, signedIn().userId, body);
    return Response.json({ round: await roundDTO(round, signedIn(), access), mailFailures }, { status: 201 });
  },
);

import { route } from '@/lib/auth/handler';
import { roundAccess } from '@/lib/rounds/access';
import { closeRound } from '@/lib/rounds/commands';
import { roundDTO } from '@/lib/rounds/queries';
import { closeRoundSchema, roundParams } from '@/lib/validation/rounds';

// POST /api/reviews/:id/rounds/:roundId/close — `{ closedWithout: [{ reviewerId, reason }] }` (author, owner); 409 while a flag is unresolved or a reviewer neither submitted nor is closed without → { round, outcome, mailFailures }.
export const POST = route(
  { params: roundParams, body: closeRoundSchema },
  async ({ params, body, authorize, signedIn }) => {
    const access = await roundAccess(params.id, params.roundId, signedIn().userId);
    authorize('review.round.read', access, 'That round');
    authorize('review.round.settle', access, 'That round');
    const { round, outcome, mailFailures } = await closeRound(access.round, signedIn().userId, body);
    return { round: await roundDTO(round, signedIn(), access), outcome, mailFailures };
  },
);

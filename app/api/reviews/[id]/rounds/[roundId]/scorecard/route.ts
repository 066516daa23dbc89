import { route } from '@/lib/auth/handler';
import { roundAccess } from '@/lib/rounds/access';
import { changeSignOff, saveScorecard } from '@/lib/rounds/commands';
import { scorecardView } from '@/lib/rounds/queries';
import { roundParams, scorecardSchema, signOffSchema } from '@/lib/validation/rounds';

// GET /api/reviews/:id/rounds/:roundId/scorecard — the review as the invited reviewer scores it (blind: no engine output, no other reviewer) and their own scorecard → ScorecardViewDTO.
export const GET = route({ params: roundParams }, async ({ params, authorize, signedIn }) => {
  const access = await roundAccess(params.id, params.roundId, signedIn().userId);
  authorize('review.round.scorecard', access, 'That round');
  return scorecardView(access.round, signedIn(), access);
});

// PUT /api/reviews/:id/rounds/:roundId/scorecard — saves the whole draft, or submits it with `submit: true` (final; mails the author) → { scorecard, mailFailures }.
export const PUT = route(
  { params: roundParams, body: scorecardSchema },
  async ({ params, body, authorize, signedIn }) => {
    const access = await roundAccess(params.id, params.roundId, signedIn().userId);
    authorize('review.round.scorecard', access, 'That round');
    return saveScorecard(access.round, signedIn().userId, body);
  },
);

// PATCH /api/reviews/:id/rounds/:roundId/scorecard — after submitting, changes only the sign-off `{ signOff }` while the round is open → { signOff }.
export const PATCH = route(
  { params: roundParams, body: signOffSchema },
  async ({ params, body, authorize, signedIn }) => {
    const access = await roundAccess(params.id, params.roundId, signedIn().userId);
    authorize('review.round.scorecard', access, 'That round');
    const card = await changeSignOff(access.round, signedIn().userId, body.signOff);
    return { signOff: card.signOff };
  },
);

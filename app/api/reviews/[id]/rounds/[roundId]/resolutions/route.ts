import { route } from '@/lib/auth/handler';
import { roundAccess } from '@/lib/rounds/access';
import { recordResolution } from '@/lib/rounds/commands';
import { roundDTO } from '@/lib/rounds/queries';
import { resolutionSchema, roundParams } from '@/lib/validation/rounds';

// POST /api/reviews/:id/rounds/:roundId/resolutions — settles one flagged mechanism `{ mechanismId, kind, reason }` (author, owner; replaces an earlier one) → { round }.
export const POST = route(
  { params: roundParams, body: resolutionSchema },
  async ({ params, body, authorize, signedIn }) => {
    const access = await roundAccess(params.id, params.roundId, signedIn().userId);
    authorize('review.round.read', access, 'That round');
    authorize('review.round.settle', access, 'That round');
    const round = await recordResolution(access.round, signedIn().userId, body);
    return { round: await roundDTO(round, signedIn(), access) };
  },
);

import { route } from '@/lib/auth/handler';
import { roundAccess } from '@/lib/rounds/access';
import { roundDTO } from '@/lib/rounds/queries';
import { roundParams } from '@/lib/validation/rounds';

// GET /api/reviews/:id/rounds/:roundId — one round (author, owner, invited reviewers; 404 to anyone else) → { round }.
export const GET = route({ params: roundParams }, async ({ params, authorize, signedIn }) => {
  const access = await roundAccess(params.id, params.roundId, signedIn().userId);
  authorize('review.round.read', access, 'That round');
  return { round: await roundDTO(access.round, signedIn(), access) };
});

import { route } from '@/lib/auth/handler';
import { roundAccess } from '@/lib/rounds/access';
import { roundAgreement } from '@/lib/rounds/queries';
import { roundParams } from '@/lib/validation/rounds';

// GET /api/reviews/:id/rounds/:roundId/agreement — α, κ, per-mechanism ratings and flags (author, owner; an invited reviewer only after submitting, 403 before) → AgreementDTO.
export const GET = route({ params: roundParams }, async ({ params, authorize, signedIn }) => {
  const access = await roundAccess(params.id, params.roundId, signedIn().userId);
  authorize('review.round.read', access, 'That round');
  authorize('review.round.agreement', access, 'That round');
  return roundAgreement(access.round);
});

import { notFound } from '@/lib/api/errors';
import type { Resource } from '@/lib/auth/policy';
import { Review, ReviewRound, RoundInvitation } from '@/models';

/**
 * The facts the policy needs about a round and the caller's place in it. A round that does not
 * belong to the review in the path answers like a missing one.
 */
export interface RoundAccess extends Resource {
  teamId: number;
  authorId: number;
  invited: boolean;
  submitted: boolean;
  round: ReviewRound;
  invitation: RoundInvitation | null;
}

export async function roundAccess(reviewId: number, roundId: number, userId: number | null): Promise<RoundAccess> {
  const round = await ReviewRound.findOne({ where: { id: roundId, reviewId } });
  if (!round) throw notFound('That round');
  const review = await Review.findByPk(reviewId, { attributes: ['id', 'teamId', 'authorId'] });
  if (!review) throw notFound('That round');
  const invitation = userId ? await RoundInvitation.findOne({ where: { roundId, reviewerId: userId } }) : null;
  return {
    teamId: review.teamId,
    authorId: review.authorId,
    invited: Boolean(invitation),
    submitted: Boolean(invitation?.submittedAt),
    round,
    invitation,
  };
}

/** The review's facts plus whether the caller is invited to (and has submitted in) a given or the latest round. */
export async function reviewRoundAccess(
  reviewId: number,
  userId: number | null,
  roundId?: number | null,
): Promise<
  Resource & { teamId: number; authorId: number; round: ReviewRound | null; invited: boolean; submitted: boolean }
> {
  const review = await Review.findByPk(reviewId, { attributes: ['id', 'teamId', 'authorId'] });
  if (!review) throw notFound('That review');
  const round = roundId
    ? await ReviewRound.findOne({ where: { id: roundId, reviewId } })
    : await ReviewRound.findOne({ where: { reviewId }, order: [['id', 'DESC']] });
  if (roundId && !round) throw notFound('That round');
  const invitation =
    round && userId ? await RoundInvitation.findOne({ where: { roundId: round.id, reviewerId: userId } }) : null;
  return {
    teamId: review.teamId,
    authorId: review.authorId,
    round,
    invited: Boolean(invitation),
    submitted: Boolean(invitation?.submittedAt),
  };
}

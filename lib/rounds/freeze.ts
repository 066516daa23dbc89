import { conflict, forbidden } from '@/lib/api/errors';
import { ReviewRound, RoundInvitation } from '@/models';

/**
 * The review is frozen while a peer-review round is open: reviewers score what the author put
 * in front of them, so its body, claim, protocol, mechanisms and appraisals cannot change under
 * them. Settling changes are made after the round closes (or the mechanism is kept with a
 * written reason). The workbench's write routes call `assertReviewEditable` first.
 */

export async function openRoundOf(reviewId: number): Promise<ReviewRound | null> {
  return ReviewRound.findOne({ where: { reviewId, status: 'open' } });
}

/** 409 while a round is open on the review; nothing otherwise. */
export async function assertReviewEditable(reviewId: number): Promise<void> {
  const round = await openRoundOf(reviewId);
  if (!round) return;
  throw conflict(
    'This review is in a peer-review round, so its text, claim, mechanisms and appraisals are frozen until the round closes. Record changes as resolutions on the round page and make them after closing.',
  );
}

/**
 * The open round in which this person is an invited reviewer who has not yet submitted: while
 * there is one, they must not see the engine's probabilities or verdict for the review (blind
 * scoring). Null when nothing is hidden from them.
 */
export async function blindRoundFor(userId: number, reviewId: number): Promise<number | null> {
  const round = await openRoundOf(reviewId);
  if (!round) return null;
  const invitation = await RoundInvitation.findOne({ where: { roundId: round.id, reviewerId: userId } });
  return invitation && !invitation.submittedAt ? round.id : null;
}

/** 403 for an invited reviewer who has not submitted yet (for the verdict route and the like). */
export async function assertSeesScores(userId: number, reviewId: number): Promise<void> {
  if ((await blindRoundFor(userId, reviewId)) === null) return;
  throw forbidden('The engine’s scores for this review stay hidden from you until you submit your scorecard.');
}

/**
 * The reviews whose engine numbers and verdict this person must not see yet: those with an open
 * round to which they are invited and have not submitted. Every read that shows a verdict,
 * probabilities, certainty or applicability asks this (blind scoring, docs/scoring.md).
 */
export async function blindReviewIds(userId: number): Promise<Set<number>> {
  const invitations = await RoundInvitation.findAll({
    where: { reviewerId: userId, submittedAt: null },
    attributes: ['roundId'],
  });
  if (!invitations.length) return new Set();
  const open = await ReviewRound.findAll({
    where: { id: invitations.map((i) => i.roundId), status: 'open' },
    attributes: ['reviewId'],
  });
  return new Set(open.map((r) => r.reviewId));
}

/**
 * Review summaries with the cached verdict blanked on the reviews where this person is still
 * scoring blind (for GET /api/reviews and the pages that list reviews).
 */
export async function withBlindVerdictsHidden<T extends { id: number; verdict: unknown; verdictLabel: unknown }>(
  userId: number,
  reviews: T[],
): Promise<T[]> {
  if (!reviews.length) return reviews;
  const blind = await blindReviewIds(userId);
  return reviews.map((r) => (blind.has(r.id) ? { ...r, verdict: null, verdictLabel: null } : r));
}

import { Op } from 'sequelize';
import { INCOMPLETE_SCORECARD, scorecardGaps } from './scorecard-complete';
import { badRequest, conflict, notFound } from '@/lib/api/errors';
import { recordEvent } from '@/lib/audit/record';
import {
  commentReplyMail,
  roundClosedMail,
  roundInvitationMail,
  scorecardSubmittedMail,
} from '@/lib/mail/round-templates';
import type { Mail } from '@/lib/mail/send';
import { writeTransaction } from '@/lib/reviews/transaction';
import type {
  CloseRoundInput,
  CommentInput,
  OpenRoundInput,
  ResolutionInput,
  ScorecardInput,
} from '@/lib/validation/rounds';
import { Comment, Mechanism, Review, ReviewRound, RoundInvitation, Scorecard, User } from '@/models';
import type { StoredRating } from '@/models/scorecard';
import { candidates, commentDTO, namesOf, roundAgreement, toScorecardDTO } from './queries';
import { deliver, roundsUrl, scorecardUrl } from './notify';
import type { CommentDTO, ScorecardDTO, SignOff } from './types';

/**
 * Every write of peer review. The route has asked the policy; these check what only the data
 * can tell (the round is open, the reviewer is a coach or reviewer of the team, every flag is
 * resolved) and write the audit log. Mail goes out after the commit (./notify.ts).
 */

const audit = (teamId: number, actorId: number, reviewId: number, action: string, data: Record<string, unknown>) => ({
  teamId,
  actorId,
  action,
  subjectType: 'review',
  subjectId: reviewId,
  data,
});

function assertOpen(round: ReviewRound) {
  if (round.status !== 'open') throw conflict('This round is closed; nothing in it can change any more.');
}

async function users(ids: number[]): Promise<Map<number, User>> {
  const list = await User.findAll({
    where: { id: { [Op.in]: [...new Set(ids)] } },
    attributes: ['id', 'name', 'email'],
  });
  return new Map(list.map((u) => [u.id, u]));
}

// ---------------------------------------------------------------------------------------------
// Opening
// ---------------------------------------------------------------------------------------------

export async function openRound(
  reviewId: number,
  actorId: number,
  input: OpenRoundInput,
): Promise<{ round: ReviewRound; mailFailures: string[] }> {
  const review = await Review.findByPk(reviewId);
  if (!review) throw notFound('That review');
  const allowed = new Map((await candidates(review.teamId, review.authorId)).map((c) => [c.userId, c]));
  const bad = input.reviewerIds.flatMap((id, index) => (allowed.has(id) ? [] : [index]));
  if (bad.length) {
    throw badRequest(
      'Reviewers must be coaches or reviewers of this team, and not the review’s author.',
      bad.map((i) => ({
        path: `reviewerIds.${i}`,
        message: 'Not a coach or reviewer of this team (or the author).',
      })),
    );
  }
  if (review.status === 'archived') throw conflict('An archived review cannot go to peer review.');

  const round = await writeTransaction(async (transaction) => {
    if (await ReviewRound.count({ where: { reviewId, status: 'open' }, transaction }))
      throw conflict('This review already has an open round. Close it before opening another.');
    if (!(await Mechanism.count({ where: { reviewId }, transaction })))
      throw conflict('Add at least one mechanism before opening a round: reviewers score mechanisms.');
    const now = new Date();
    const created = await ReviewRound.create(
      {
        reviewId,
        teamId: review.teamId,
        openedById: actorId,
        openedAt: now,
        dueAt: input.dueAt,
        note: input.note,
        resolutions: [],
      },
      { transaction },
    );
    for (const reviewerId of input.reviewerIds) {
      await RoundInvitation.create({ roundId: created.id, reviewerId, invitedAt: now }, { transaction });
    }
    // Status only: the version is left alone so an editor open elsewhere is not told it is stale.
    await Review.update({ status: 'in-review' }, { where: { id: reviewId }, transaction, silent: true });
    await recordEvent(
      audit(review.teamId, actorId, reviewId, 'round.opened', {
        roundId: created.id,
        reviewerIds: input.reviewerIds,
        dueAt: input.dueAt.toISOString(),
      }),
      transaction,
    );
    return created;
  });

  const people = await users([actorId, ...input.reviewerIds]);
  const opener = people.get(actorId)?.name ?? 'A colleague';
  const mails: Mail[] = input.reviewerIds.flatMap((id) => {
    const person = people.get(id);
    return person
      ? [
          roundInvitationMail({
            to: person.email,
            reviewerName: person.name,
            authorName: opener,
            reviewTitle: review.title,
            dueAt: input.dueAt,
            note: input.note,
            url: scorecardUrl(reviewId, round.id),
          }),
        ]
      : [];
  });
  const { failed } = await deliver(mails);
  return { round, mailFailures: failed };
}

// ---------------------------------------------------------------------------------------------
// Scorecards
// ---------------------------------------------------------------------------------------------

/**
 * PUT …/scorecard: saves the whole draft (autosave) or, with `submit`, makes it final. A final
 * scorecard needs a band and a contribution for every mechanism and a sign-off, and mails the
 * author.
 */
export async function saveScorecard(
  round: ReviewRound,
  reviewerId: number,
  input: ScorecardInput,
): Promise<{ scorecard: ScorecardDTO; mailFailures: string[] }> {
  assertOpen(round);
  const mechanisms = await Mechanism.findAll({
    where: { reviewId: round.reviewId },
    attributes: ['id', 'name', 'position'],
    order: [
      ['position', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  const known = new Set(mechanisms.map((m) => m.id));
  const strangers = input.ratings.flatMap((r, i) => (known.has(r.mechanismId) ? [] : [i]));
  if (strangers.length) {
    throw badRequest(
      'A rating names a mechanism that is not part of this review.',
      strangers.map((i) => ({
        path: `ratings.${i}.mechanismId`,
        message: 'Not a mechanism of this review.',
      })),
    );
  }
  const seen = new Set<number>();
  input.ratings.forEach((r, i) => {
    if (seen.has(r.mechanismId))
      throw badRequest('A mechanism is rated twice.', [{ path: `ratings.${i}.mechanismId`, message: 'Rated twice.' }]);
    seen.add(r.mechanismId);
  });
  if (input.submit) {
    const issues = scorecardGaps(mechanisms, input);
    if (issues.length) throw badRequest(INCOMPLETE_SCORECARD, issues);
  }
  const ratings: StoredRating[] = input.ratings.map((r) => ({
    mechanismId: r.mechanismId,
    band: r.band,
    contribution: r.contribution,
    comment: r.comment,
  }));

  const card = await writeTransaction(async (transaction) => {
    const fresh = await ReviewRound.findByPk(round.id, { transaction });
    if (!fresh || fresh.status !== 'open') throw conflict('This round is closed; nothing in it can change any more.');
    const existing = await Scorecard.findOne({ where: { roundId: round.id, reviewerId }, transaction });
    if (existing?.submittedAt) throw conflict('You have already submitted this scorecard; a submission is final.');
    const values = { ratings, overallComment: input.overallComment, signOff: input.signOff };
    const now = new Date();
    const saved = existing
      ? await existing.update({ ...values, ...(input.submit ? { submittedAt: now } : {}) }, { transaction })
      : await Scorecard.create(
          { roundId: round.id, reviewerId, ...values, submittedAt: input.submit ? now : null },
          { transaction },
        );
    if (input.submit) {
      await RoundInvitation.update({ submittedAt: now }, { where: { roundId: round.id, reviewerId }, transaction });
      await recordEvent(
        audit(round.teamId, reviewerId, round.reviewId, 'round.scorecard_submitted', {
          roundId: round.id,
          signOff: input.signOff,
        }),
        transaction,
      );
    }
    return saved;
  });

  const scorecard = toScorecardDTO(
    card,
    round.id,
    reviewerId,
    mechanisms.map((m) => m.id),
  );
  if (!input.submit) return { scorecard, mailFailures: [] };
  const review = await Review.findByPk(round.reviewId, { attributes: ['id', 'title', 'authorId'] });
  const invitations = await RoundInvitation.findAll({ where: { roundId: round.id } });
  const people = await users([review!.authorId, reviewerId]);
  const author = people.get(review!.authorId);
  const { failed } = await deliver(
    author
      ? [
          scorecardSubmittedMail({
            to: author.email,
            authorName: author.name,
            reviewerName: people.get(reviewerId)?.name ?? 'A reviewer',
            reviewTitle: review!.title,
            submitted: invitations.filter((i) => i.submittedAt).length,
            invited: invitations.length,
            url: roundsUrl(round.reviewId, round.id),
          }),
        ]
      : [],
  );
  return { scorecard, mailFailures: failed };
}

/** After submitting, a reviewer may change their sign-off while the round is open (e.g. withdraw a "do not publish" once settled). */
export async function changeSignOff(round: ReviewRound, reviewerId: number, signOff: SignOff): Promise<Scorecard> {
  assertOpen(round);
  return writeTransaction(async (transaction) => {
    const card = await Scorecard.findOne({ where: { roundId: round.id, reviewerId }, transaction });
    if (!card?.submittedAt)
      throw conflict('Submit your scorecard first; until then the sign-off is part of the draft.');
    const before = card.signOff;
    await card.update({ signOff }, { transaction });
    await recordEvent(
      audit(round.teamId, reviewerId, round.reviewId, 'round.signoff_changed', {
        roundId: round.id,
        from: before,
        to: signOff,
      }),
      transaction,
    );
    return card;
  });
}

// ---------------------------------------------------------------------------------------------
// Settling and closing
// ---------------------------------------------------------------------------------------------

export async function recordResolution(
  round: ReviewRound,
  actorId: number,
  input: ResolutionInput,
): Promise<ReviewRound> {
  assertOpen(round);
  const agreement = await roundAgreement(round);
  const row = agreement.mechanisms.find((m) => m.mechanismId === input.mechanismId);
  if (!row)
    throw badRequest('That mechanism is not part of this review.', [
      { path: 'mechanismId', message: 'Not a mechanism of this review.' },
    ]);
  if (!row.flagged)
    throw badRequest('Only flagged mechanisms (ratings two or more bands apart) take a resolution.', [
      { path: 'mechanismId', message: 'This mechanism is not flagged.' },
    ]);
  return writeTransaction(async (transaction) => {
    const fresh = await ReviewRound.findByPk(round.id, { transaction });
    if (!fresh || fresh.status !== 'open') throw conflict('This round is closed; nothing in it can change any more.');
    const resolution = {
      mechanismId: input.mechanismId,
      kind: input.kind,
      reason: input.reason,
      byId: actorId,
      at: new Date().toISOString(),
    };
    const others = (fresh.resolutions ?? []).filter((r) => r.mechanismId !== input.mechanismId);
    await fresh.update({ resolutions: [...others, resolution] }, { transaction });
    await recordEvent(
      audit(round.teamId, actorId, round.reviewId, 'round.resolution_recorded', {
        roundId: round.id,
        mechanismId: input.mechanismId,
        kind: input.kind,
      }),
      transaction,
    );
    return fresh;
  });
}

/**
 * Closes the round when every flag is resolved and every invited reviewer submitted or is
 * closed without (with a reason). The review becomes "approved" when no submitted "do not
 * publish" stands, else goes back to "draft"; either way it is editable again.
 */
export async function closeRound(
  round: ReviewRound,
  actorId: number,
  input: CloseRoundInput,
): Promise<{ round: ReviewRound; outcome: 'approved' | 'draft'; mailFailures: string[] }> {
  assertOpen(round);
  const invitations = await RoundInvitation.findAll({ where: { roundId: round.id } });
  const byReviewer = new Map(invitations.map((i) => [i.reviewerId, i]));
  const reasons = new Map(input.closedWithout.map((c) => [c.reviewerId, c.reason]));
  const wrong = input.closedWithout.flatMap((c, i) => {
    const invitation = byReviewer.get(c.reviewerId);
    if (!invitation) return [{ path: `closedWithout.${i}.reviewerId`, message: 'Not invited to this round.' }];
    if (invitation.submittedAt) return [{ path: `closedWithout.${i}.reviewerId`, message: 'Already submitted.' }];
    return [];
  });
  if (wrong.length) throw badRequest('“Close without” is for invited reviewers who have not submitted.', wrong);

  const agreement = await roundAgreement(round);
  const names = await namesOf(invitations.map((i) => i.reviewerId));
  const blockers: string[] = [];
  if (agreement.unresolvedFlags > 0) {
    const open = agreement.mechanisms.filter((m) => m.flagged && !m.resolution).map((m) => `“${m.name}”`);
    blockers.push(`resolve the flagged mechanism${open.length === 1 ? '' : 's'} ${open.join(', ')}`);
  }
  const waiting = invitations.filter((i) => !i.submittedAt && !reasons.has(i.reviewerId));
  if (waiting.length) {
    blockers.push(
      `wait for ${waiting.map((i) => names.get(i.reviewerId) ?? 'a former member').join(', ')} or close without them, with a reason`,
    );
  }
  if (blockers.length) throw conflict(`The round cannot close yet: ${blockers.join('; and ')}.`);

  const standing = agreement.signOffs.filter((s) => s.signOff === 'do-not-publish');
  const outcome: 'approved' | 'draft' = agreement.raters > 0 && standing.length === 0 ? 'approved' : 'draft';
  const closed = await writeTransaction(async (transaction) => {
    const fresh = await ReviewRound.findByPk(round.id, { transaction });
    if (!fresh || fresh.status !== 'open') throw conflict('This round is already closed.');
    for (const [reviewerId, reason] of reasons) {
      await RoundInvitation.update(
        { closedWithoutReason: reason },
        { where: { roundId: round.id, reviewerId }, transaction },
      );
      await recordEvent(
        audit(round.teamId, actorId, round.reviewId, 'round.closed_without', { roundId: round.id, reviewerId, reason }),
        transaction,
      );
    }
    await fresh.update({ status: 'closed', closedAt: new Date(), closedById: actorId, outcome }, { transaction });
    await Review.update({ status: outcome }, { where: { id: round.reviewId }, transaction, silent: true });
    await recordEvent(
      audit(round.teamId, actorId, round.reviewId, 'round.closed', {
        roundId: round.id,
        outcome,
        alpha: agreement.alpha.ordinal,
        flagged: agreement.flaggedCount,
        doNotPublish: standing.map((s) => s.reviewerId),
      }),
      transaction,
    );
    return fresh;
  });

  const review = await Review.findByPk(round.reviewId, { attributes: ['id', 'title', 'authorId'] });
  const people = await users([actorId, review!.authorId, ...invitations.map((i) => i.reviewerId)]);
  const closer = people.get(actorId)?.name ?? 'A colleague';
  const recipients = new Set([review!.authorId, ...invitations.map((i) => i.reviewerId)]);
  recipients.delete(actorId);
  const mails = [...recipients].flatMap((id) => {
    const person = people.get(id);
    const isReviewer = byReviewer.has(id);
    return person
      ? [
          roundClosedMail({
            to: person.email,
            recipientName: person.name,
            closerName: closer,
            reviewTitle: review!.title,
            outcome,
            url: isReviewer ? scorecardUrl(round.reviewId, round.id) : roundsUrl(round.reviewId, round.id),
          }),
        ]
      : [];
  });
  const { failed } = await deliver(mails);
  return { round: closed, outcome, mailFailures: failed };
}

// ---------------------------------------------------------------------------------------------
// Comments
// ---------------------------------------------------------------------------------------------

export async function postComment(
  reviewId: number,
  round: ReviewRound,
  actorId: number,
  input: CommentInput,
): Promise<{ comment: CommentDTO; mailFailures: string[] }> {
  assertOpen(round);
  let parent: Comment | null = null;
  if (input.parentId !== null) {
    parent = await Comment.findOne({ where: { id: input.parentId, reviewId, roundId: round.id } });
    if (!parent)
      throw badRequest('The comment you reply to is not in this round.', [
        { path: 'parentId', message: 'No such comment here.' },
      ]);
    // Threads are one level deep: a reply to a reply joins the thread's root.
    if (parent.parentId !== null) parent = await Comment.findByPk(parent.parentId);
  }
  const mechanismId = parent ? parent.mechanismId : input.mechanismId;
  if (!parent && mechanismId !== null && !(await Mechanism.count({ where: { id: mechanismId, reviewId } }))) {
    throw badRequest('That mechanism is not part of this review.', [
      { path: 'mechanismId', message: 'Not a mechanism of this review.' },
    ]);
  }
  const comment = await writeTransaction(async (transaction) => {
    const created = await Comment.create(
      { reviewId, roundId: round.id, mechanismId, authorId: actorId, parentId: parent?.id ?? null, body: input.body },
      { transaction },
    );
    if (parent?.resolved)
      await parent.update({ resolved: false, resolvedById: null, resolvedAt: null }, { transaction });
    await recordEvent(
      audit(round.teamId, actorId, reviewId, 'round.comment_posted', {
        roundId: round.id,
        commentId: created.id,
        mechanismId,
        reply: Boolean(parent),
      }),
      transaction,
    );
    return created;
  });
  const names = await namesOf([actorId]);
  let mailFailures: string[] = [];
  // A reply tells the thread's starter (not someone replying to themselves).
  if (parent && parent.authorId && parent.authorId !== actorId) {
    const people = await users([parent.authorId]);
    const recipient = people.get(parent.authorId);
    const review = await Review.findByPk(reviewId, { attributes: ['id', 'title'] });
    const invited = await RoundInvitation.count({ where: { roundId: round.id, reviewerId: parent.authorId } });
    if (recipient && review) {
      const excerpt = input.body.length > 280 ? `${input.body.slice(0, 277)}…` : input.body;
      const url = invited ? scorecardUrl(reviewId, round.id) : roundsUrl(reviewId, round.id);
      mailFailures = (
        await deliver([
          commentReplyMail({
            to: recipient.email,
            recipientName: recipient.name,
            replierName: names.get(actorId) ?? 'A colleague',
            reviewTitle: review.title,
            excerpt,
            url: `${url.split('#')[0]}#comment-${comment.id}`,
          }),
        ])
      ).failed;
    }
  }
  return { comment: commentDTO(comment, names), mailFailures };
}

export async function setCommentResolved(
  reviewId: number,
  commentId: number,
  actorId: number,
  resolved: boolean,
): Promise<CommentDTO> {
  const comment = await Comment.findOne({ where: { id: commentId, reviewId } });
  if (!comment) throw notFound('That comment');
  if (comment.parentId !== null)
    throw badRequest('Resolve the thread from its first comment.', [
      { path: 'commentId', message: 'This is a reply.' },
    ]);
  const round = comment.roundId ? await ReviewRound.findByPk(comment.roundId) : null;
  if (round) assertOpen(round);
  await writeTransaction(async (transaction) => {
    await comment.update(
      resolved
        ? { resolved: true, resolvedById: actorId, resolvedAt: new Date() }
        : { resolved: false, resolvedById: null, resolvedAt: null },
      { transaction },
    );
    await recordEvent(
      audit(
        round?.teamId ?? (await Review.findByPk(reviewId, { attributes: ['teamId'], transaction }))!.teamId,
        actorId,
        reviewId,
        'round.comment_resolved',
        {
          roundId: comment.roundId,
          commentId,
          resolved,
        },
      ),
      transaction,
    );
  });
  const names = await namesOf([comment.authorId, comment.resolvedById]);
  return commentDTO(comment, names);
}

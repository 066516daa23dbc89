import { Op } from 'sequelize';
import { notFound } from '@/lib/api/errors';
import { decide, type Actor } from '@/lib/auth/policy';
import { toPopulationDTO, toProtocolDTO } from '@/lib/reviews/rows';
import { loadReviewData, verdictFromData } from '@/lib/reviews/verdict';
import { pickDomains } from '@/lib/scoring/appraisal-vocabulary';
import { bodyReferences } from '@/lib/validation/reviews';
import {
  AuditEvent,
  Comment,
  Membership,
  Review,
  ReviewRound,
  RoundInvitation,
  Scorecard,
  Study,
  User,
} from '@/models';
import { assembleAgreement } from './agreement';
import type {
  AgreementDTO,
  BlindAppraisalDTO,
  BlindMechanismDTO,
  BlindStudyDTO,
  CandidateDTO,
  CommentDTO,
  Contribution,
  InvitationDTO,
  PendingScorecardDTO,
  RatingDTO,
  ResolutionDTO,
  ResolutionKind,
  RoundAuditDTO,
  RoundDTO,
  ScorecardDTO,
  ScorecardViewDTO,
  SignOff,
} from './types';

/** Reads of peer review. Blindness is decided here, by what each reader is given at all. */

export async function namesOf(ids: (number | null | undefined)[]): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((id): id is number => typeof id === 'number'))];
  if (!wanted.length) return new Map();
  const users = await User.findAll({ where: { id: { [Op.in]: wanted } }, attributes: ['id', 'name'] });
  return new Map(users.map((u) => [u.id, u.name]));
}

const iso = (date: Date | null | undefined) => (date ? new Date(date).toISOString() : null);

function resolutionDTOs(round: ReviewRound, names: Map<number, string>): ResolutionDTO[] {
  return (round.resolutions ?? []).map((r) => ({
    mechanismId: r.mechanismId,
    kind: r.kind as ResolutionKind,
    reason: r.reason,
    byId: r.byId,
    byName: names.get(r.byId) ?? 'Former member',
    at: r.at,
  }));
}

/**
 * A round as `actor` may see it: the author and owner see every invitation and resolution; an
 * invited reviewer sees their own invitation only (not who else scores, nor how far they are).
 */
export async function roundDTO(
  round: ReviewRound,
  actor: Actor,
  access: { teamId: number; authorId: number },
): Promise<RoundDTO> {
  const manages = decide(actor, 'review.round.settle', access) === 'allow';
  const invitations = await RoundInvitation.findAll({ where: { roundId: round.id }, order: [['id', 'ASC']] });
  const mine = invitations.find((i) => i.reviewerId === actor.userId) ?? null;
  const shown = manages ? invitations : mine ? [mine] : [];
  const names = await namesOf([
    round.openedById,
    ...shown.map((i) => i.reviewerId),
    ...(manages ? (round.resolutions ?? []).map((r) => r.byId) : []),
  ]);
  return {
    id: round.id,
    reviewId: round.reviewId,
    status: round.status as RoundDTO['status'],
    openedById: round.openedById,
    openedByName: (round.openedById && names.get(round.openedById)) || 'Former member',
    openedAt: iso(round.openedAt)!,
    dueAt: iso(round.dueAt)!,
    closedAt: iso(round.closedAt),
    outcome: (round.outcome as RoundDTO['outcome']) ?? null,
    note: round.note ?? '',
    invitations: shown.map((i): InvitationDTO => ({
      reviewerId: i.reviewerId,
      reviewerName: names.get(i.reviewerId) ?? 'Former member',
      invitedAt: iso(i.invitedAt)!,
      submittedAt: iso(i.submittedAt),
      closedWithoutReason: i.closedWithoutReason ?? null,
      remindedAt: iso(i.remindedAt),
    })),
    resolutions: manages ? resolutionDTOs(round, names) : [],
    you: { invited: Boolean(mine), submitted: Boolean(mine?.submittedAt), manages },
  };
}

/** GET /api/reviews/:id/rounds: the rounds the caller may see, newest first, plus what the management page needs. */
export async function listRounds(
  reviewId: number,
  actor: Actor,
  access: { teamId: number; authorId: number },
): Promise<{ rounds: RoundDTO[]; candidates?: CandidateDTO[]; audit?: RoundAuditDTO[] }> {
  const manages = decide(actor, 'review.round.settle', access) === 'allow';
  const all = await ReviewRound.findAll({ where: { reviewId }, order: [['id', 'DESC']] });
  let visible = all;
  if (!manages) {
    const mine = await RoundInvitation.findAll({
      where: { reviewerId: actor.userId, roundId: { [Op.in]: all.map((r) => r.id) } },
      attributes: ['roundId'],
    });
    const ids = new Set(mine.map((i) => i.roundId));
    visible = all.filter((r) => ids.has(r.id));
  }
  const rounds = await Promise.all(visible.map((r) => roundDTO(r, actor, access)));
  if (!manages) return { rounds };
  const result: { rounds: RoundDTO[]; candidates?: CandidateDTO[]; audit?: RoundAuditDTO[] } = {
    rounds,
    candidates: await candidates(access.teamId, access.authorId),
  };
  // The audit log of round events is the owner's to read (team.audit.read).
  if (decide(actor, 'team.audit.read', access) === 'allow') result.audit = await roundAudit(reviewId);
  return result;
}

/** The team's coaches and reviewers, without the review's author. */
export async function candidates(teamId: number, authorId: number): Promise<CandidateDTO[]> {
  const memberships = await Membership.findAll({
    where: { teamId, role: { [Op.in]: ['coach', 'reviewer'] }, userId: { [Op.ne]: authorId } },
    include: [{ model: User, as: 'user', attributes: ['id', 'name', 'email'] }],
    order: [['id', 'ASC']],
  });
  return memberships.flatMap((m) => {
    const user = (m as Membership & { user?: User }).user;
    return user ? [{ userId: user.id, name: user.name, email: user.email, role: m.role as 'coach' | 'reviewer' }] : [];
  });
}

export async function roundAudit(reviewId: number): Promise<RoundAuditDTO[]> {
  const events = await AuditEvent.findAll({
    where: { subjectType: 'review', subjectId: reviewId, action: { [Op.like]: 'round.%' } },
    order: [['id', 'DESC']],
    limit: 200,
  });
  const names = await namesOf(events.map((e) => e.actorId));
  return events.map((e) => ({
    id: e.id,
    action: e.action,
    actorName: e.actorId ? (names.get(e.actorId) ?? 'Former member') : 'Loadbearing',
    at: iso(e.createdAt)!,
    data: e.data ?? null,
  }));
}

export function toScorecardDTO(
  card: Scorecard | null,
  roundId: number,
  reviewerId: number,
  mechanismIds: number[],
): ScorecardDTO {
  const stored = new Map((card?.ratings ?? []).map((r) => [r.mechanismId, r]));
  // One rating per current mechanism, in the review's order, so the form always lines up.
  const ratings: RatingDTO[] = mechanismIds.map((mechanismId) => {
    const r = stored.get(mechanismId);
    return {
      mechanismId,
      band: r?.band ?? null,
      contribution: (r?.contribution as Contribution | null) ?? null,
      comment: r?.comment ?? '',
    };
  });
  return {
    roundId,
    reviewerId,
    ratings,
    overallComment: card?.overallComment ?? '',
    signOff: (card?.signOff as SignOff | null) ?? null,
    submittedAt: iso(card?.submittedAt),
    updatedAt: iso(card?.updatedAt),
  };
}

/**
 * GET …/scorecard: the review as the reviewer scores it — the author's inputs (body, protocol,
 * mechanisms with their priors, studies, appraisal domains) and their own scorecard. Nothing
 * the engine derives (probabilities, certainty, verdict) and nothing of other reviewers.
 */
export async function scorecardView(
  round: ReviewRound,
  actor: Actor,
  access: { teamId: number; authorId: number },
): Promise<ScorecardViewDTO> {
  const data = await loadReviewData(round.reviewId);
  if (!data) throw notFound('That review');
  const { review, mechanisms, appraisals, studies } = data;
  const card = await Scorecard.findOne({ where: { roundId: round.id, reviewerId: actor.userId } });
  const author = await namesOf([review.authorId]);
  const blindMechanisms: BlindMechanismDTO[] = mechanisms.map((m) => ({
    id: m.id,
    name: m.name,
    kind: m.kind,
    summary: m.summary,
    minIntensity: m.minIntensity,
    minEffort: m.minEffort,
    prior: m.prior,
    magnitude: m.magnitude,
    stated: m.stated,
    position: m.position,
  }));
  // Studies cited inline in the body (same team) are shown too, so every citation resolves.
  const citedIds = bodyReferences(review.body).studyIds.filter((id) => !studies.has(id));
  const cited = citedIds.length
    ? await Study.findAll({ where: { id: { [Op.in]: citedIds }, teamId: review.teamId } })
    : [];
  const blindStudies: BlindStudyDTO[] = [...studies.values(), ...cited]
    .sort((a, b) => a.id - b.id)
    .map((s) => ({
      id: s.id,
      citation: s.citation,
      title: s.title,
      year: s.year,
      journal: s.journal,
      design: s.design,
      population: s.population,
      n: s.n,
      intensity: s.intensity,
      durationWeeks: s.durationWeeks,
      outcome: s.outcome,
    }));
  const blindAppraisals: BlindAppraisalDTO[] = appraisals.map((a) => ({
    id: a.id,
    studyId: a.studyId,
    mechanismId: a.mechanismId,
    direction: a.direction,
    ...pickDomains(a),
    notes: a.notes,
    directionReason: a.directionReason ?? null,
  }));
  return {
    round: await roundDTO(round, actor, access),
    review: {
      id: review.id,
      teamId: review.teamId,
      title: review.title,
      claim: review.claim,
      claimSource: review.claimSource,
      claimUrl: review.claimUrl,
      authorName: author.get(review.authorId) ?? 'Former member',
      protocol: toProtocolDTO(review.protocol),
      population: toPopulationDTO(review),
      body: review.body,
    },
    mechanisms: blindMechanisms,
    studies: blindStudies,
    appraisals: blindAppraisals,
    scorecard: toScorecardDTO(
      card,
      round.id,
      actor.userId,
      mechanisms.map((m) => m.id),
    ),
  };
}

/** The figures and flags of a round, from its submitted scorecards (drafts never count). */
export async function roundAgreement(round: ReviewRound): Promise<AgreementDTO> {
  const data = await loadReviewData(round.reviewId);
  if (!data) throw notFound('That review');
  const verdict = verdictFromData(data);
  const probability = new Map(verdict.mechanisms.map((m) => [Number(m.id), m.probability]));
  const cards = await Scorecard.findAll({
    where: { roundId: round.id, submittedAt: { [Op.ne]: null } },
    order: [
      ['submittedAt', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  const invitations = await RoundInvitation.findAll({ where: { roundId: round.id }, order: [['id', 'ASC']] });
  const names = await namesOf([
    ...cards.map((c) => c.reviewerId),
    ...invitations.map((i) => i.reviewerId),
    ...(round.resolutions ?? []).map((r) => r.byId),
  ]);
  const figures = assembleAgreement({
    mechanisms: data.mechanisms.map((m) => ({
      id: m.id,
      name: m.name,
      position: m.position,
      engineProbability: probability.get(m.id) ?? m.prior,
    })),
    scorecards: cards.map((c) => ({
      reviewerId: c.reviewerId,
      reviewerName: names.get(c.reviewerId) ?? 'Former member',
      ratings: c.ratings.map((r) => ({
        mechanismId: r.mechanismId,
        band: r.band,
        contribution: r.contribution as Contribution | null,
        comment: r.comment,
      })),
    })),
    resolutions: resolutionDTOs(round, names),
  });
  const waiting = invitations.filter((i) => !i.submittedAt && !i.closedWithoutReason);
  const blockers: string[] = [];
  if (round.status === 'open') {
    if (figures.unresolvedFlags > 0)
      blockers.push(
        `${figures.unresolvedFlags} flagged mechanism${figures.unresolvedFlags === 1 ? ' needs' : 's need'} a resolution.`,
      );
    if (waiting.length)
      blockers.push(
        `Waiting for ${waiting.map((i) => names.get(i.reviewerId) ?? 'a former member').join(', ')}: wait for their scorecard or close without it, with a reason.`,
      );
  }
  return {
    roundId: round.id,
    status: round.status as AgreementDTO['status'],
    ...figures,
    signOffs: cards.map((c) => ({
      reviewerId: c.reviewerId,
      reviewerName: names.get(c.reviewerId) ?? 'Former member',
      signOff: (c.signOff as SignOff | null) ?? null,
      overallComment: c.overallComment,
    })),
    blockers,
  };
}

/**
 * The comments of a review's round the caller may read. An invited reviewer who has not
 * submitted does not see the other invited reviewers' comments: those could give their scores
 * away before the caller has scored blind.
 */
export async function listComments(
  reviewId: number,
  roundId: number,
  actor: Actor,
  blind: boolean,
): Promise<CommentDTO[]> {
  let comments = await Comment.findAll({ where: { reviewId, roundId }, order: [['id', 'ASC']] });
  if (blind) {
    const invitees = new Set(
      (await RoundInvitation.findAll({ where: { roundId }, attributes: ['reviewerId'] })).map((i) => i.reviewerId),
    );
    const hidden = new Set(
      comments
        .filter((c) => c.authorId !== null && c.authorId !== actor.userId && invitees.has(c.authorId))
        .map((c) => c.id),
    );
    comments = comments.filter((c) => !hidden.has(c.id) && !(c.parentId !== null && hidden.has(c.parentId)));
  }
  const names = await namesOf(comments.flatMap((c) => [c.authorId, c.resolvedById]));
  return comments.map((c) => commentDTO(c, names));
}

export function commentDTO(c: Comment, names: Map<number, string>): CommentDTO {
  return {
    id: c.id,
    reviewId: c.reviewId,
    roundId: c.roundId,
    mechanismId: c.mechanismId,
    authorId: c.authorId,
    authorName: (c.authorId && names.get(c.authorId)) || 'Former member',
    parentId: c.parentId,
    body: c.body,
    resolved: c.resolved,
    resolvedByName: c.resolvedById ? (names.get(c.resolvedById) ?? 'Former member') : null,
    resolvedAt: iso(c.resolvedAt),
    createdAt: iso(c.createdAt)!,
  };
}

/** The review's title and author, for mails and page headers. */
export async function reviewHeadline(
  reviewId: number,
): Promise<{ title: string; authorId: number; teamId: number; status: string }> {
  const review = await Review.findByPk(reviewId, { attributes: ['id', 'title', 'authorId', 'teamId', 'status'] });
  if (!review) throw notFound('That review');
  return { title: review.title, authorId: review.authorId, teamId: review.teamId, status: review.status };
}

/**
 * The scorecards this person still owes, soonest due first: open rounds they were invited to
 * and have not submitted (for the dashboard; the round mails link to the same pages).
 */
export async function pendingScorecards(userId: number, now = new Date()): Promise<PendingScorecardDTO[]> {
  const invitations = await RoundInvitation.findAll({ where: { reviewerId: userId, submittedAt: null } });
  if (!invitations.length) return [];
  const rounds = await ReviewRound.findAll({
    where: { id: invitations.map((i) => i.roundId), status: 'open' },
    order: [['dueAt', 'ASC']],
  });
  if (!rounds.length) return [];
  const [reviews, drafts] = await Promise.all([
    Review.findAll({ where: { id: rounds.map((r) => r.reviewId) }, attributes: ['id', 'title'] }),
    Scorecard.findAll({ where: { reviewerId: userId, roundId: rounds.map((r) => r.id) }, attributes: ['roundId'] }),
  ]);
  const title = new Map(reviews.map((r) => [r.id, r.title]));
  const drafted = new Set(drafts.map((d) => d.roundId));
  return rounds.map((r) => ({
    reviewId: r.reviewId,
    roundId: r.id,
    title: title.get(r.reviewId) ?? 'Untitled review',
    dueAt: r.dueAt.toISOString(),
    overdue: r.dueAt.getTime() < now.getTime(),
    draftSaved: drafted.has(r.id),
  }));
}

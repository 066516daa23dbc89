import { badRequest, conflict, notFound } from '@/lib/api/errors';
import type { Actor } from '@/lib/auth/policy';
import { recordEvent } from '@/lib/audit/record';
import { env } from '@/lib/env';
import { notifyFollowers } from '@/lib/follows/follows';
import { writeTransaction } from '@/lib/reviews/transaction';
import { onReviewChanged } from '@/lib/search/index-store';
import { removeVerdict, upsertVerdict, verdictDoc } from '@/lib/search/verdict-index';
import { uniqueSlug } from '@/lib/teams/slug';
import type { PublishInput } from '@/lib/validation/publishing';
import { Publication, PublishedVersion, Review, Team, User } from '@/models';
import { listItem } from './queries';
import { teamSettings } from './settings';
import { buildSnapshot } from './snapshot';
import type { PublishResultDTO, Visibility } from './types';

/**
 * Publishing and withdrawing. The route has asked the policy (`review.publish`, with the team's
 * `coachesMayPublish`); these check what only the data can tell: the review's status against
 * the team's peer-review setting, and the "what changed" note from version 2 on.
 */

/** Statuses a review may be published from; `published` = a new version of a live verdict. */
function publishable(status: string, requirePeerReview: boolean): boolean {
  if (status === 'archived') return false;
  return requirePeerReview ? status === 'approved' || status === 'published' : true;
}

/** The facts the policy needs: the review's team and author, and whether the team lets coaches publish. */
export async function publishAccess(reviewId: number) {
  const review = await Review.findByPk(reviewId, { attributes: ['id', 'teamId', 'authorId'] });
  if (!review) throw notFound('That review');
  const settings = await teamSettings(review.teamId);
  return { teamId: review.teamId, authorId: review.authorId, coachesMayPublish: settings?.coachesMayPublish ?? false };
}

export async function publishReview(reviewId: number, actor: Actor, input: PublishInput): Promise<PublishResultDTO> {
  const review = await Review.findByPk(reviewId);
  if (!review) throw notFound('That review');
  const settings = await teamSettings(review.teamId);
  if (!settings) throw notFound('That review');
  if (!publishable(review.status, settings.requirePeerReview)) {
    throw conflict(
      review.status === 'archived'
        ? 'An archived review cannot be published.'
        : 'This team publishes only reviews approved in peer review; close a review round first.',
    );
  }
  const existing = await Publication.findOne({ where: { reviewId } });
  const number = (existing?.latestNumber ?? 0) + 1;
  if (number > 1 && !input.changeNote) {
    throw badRequest('Say what changed since the last version: readers see it.', [
      { path: 'changeNote', message: `Version ${number} needs a “what changed” note.` },
    ]);
  }
  // Built before the write lock is taken: formatting references and rendering the body take a moment.
  const snapshot = await buildSnapshot(reviewId);
  if (!snapshot) throw notFound('That review');

  const { publication, version } = await writeTransaction(async (transaction) => {
    const now = new Date();
    let pub = await Publication.findOne({ where: { reviewId }, transaction });
    if (pub && pub.latestNumber + 1 !== number)
      throw conflict('Someone published this review at the same moment; reload and try again.');
    if (!pub) {
      const slug = await uniqueSlug(
        review.slug,
        async (s) => (await Publication.count({ where: { slug: s }, transaction })) > 0,
      );
      pub = await Publication.create(
        {
          reviewId,
          teamId: review.teamId,
          slug,
          visibility: input.visibility,
          latestNumber: number,
          lastPublishedAt: now,
          withdrawnAt: null,
          withdrawnReason: null,
          withdrawnById: null,
        },
        { transaction },
      );
    } else {
      // A new version also lifts an earlier withdrawal.
      await pub.update(
        {
          visibility: input.visibility,
          latestNumber: number,
          lastPublishedAt: now,
          withdrawnAt: null,
          withdrawnReason: null,
          withdrawnById: null,
        },
        { transaction },
      );
    }
    const created = await PublishedVersion.create(
      {
        publicationId: pub.id,
        number,
        publishedById: actor.userId,
        changeNote: input.changeNote ?? null,
        snapshot: snapshot as unknown as Record<string, unknown>,
      },
      { transaction },
    );
    await Review.update({ status: 'published' }, { where: { id: reviewId }, transaction });
    await recordEvent(
      {
        teamId: review.teamId,
        actorId: actor.userId,
        action: 'review.published',
        subjectType: 'review',
        subjectId: reviewId,
        data: { slug: pub.slug, version: number, visibility: input.visibility },
      },
      transaction,
    );
    return { publication: pub, version: created };
  });

  await afterChange(publication, snapshot);
  const notified = await notifyFollowers({
    teamId: review.teamId,
    visibility: input.visibility,
    slug: publication.slug,
    title: snapshot.title,
    claim: snapshot.claim,
    verdictLabel: snapshot.verdict.label,
    summary: snapshot.verdict.summary,
    version: number,
    changeNote: input.changeNote ?? null,
  });
  const publisher = await User.findByPk(actor.userId, { attributes: ['name'] });
  return {
    slug: publication.slug,
    url: `${env().APP_URL}/v/${publication.slug}`,
    visibility: publication.visibility as Visibility,
    notified,
    version: {
      number: version.number,
      publishedAt: version.createdAt.toISOString(),
      publishedBy: publisher?.name ?? 'Former member',
      changeNote: version.changeNote,
    },
  };
}

/** Withdraws the verdict: the versions stay, readers see that it was withdrawn and why. */
export async function unpublishReview(reviewId: number, actor: Actor, reason: string) {
  const publication = await Publication.findOne({ where: { reviewId } });
  if (!publication) throw conflict('This review has not been published.');
  if (publication.withdrawnAt) throw conflict('This verdict is already withdrawn.');
  await writeTransaction(async (transaction) => {
    await publication.update(
      { withdrawnAt: new Date(), withdrawnReason: reason, withdrawnById: actor.userId },
      { transaction },
    );
    // Back to approved: republishing (with a "what changed" note) brings it back.
    await Review.update({ status: 'approved' }, { where: { id: reviewId, status: 'published' }, transaction });
    await recordEvent(
      {
        teamId: publication.teamId,
        actorId: actor.userId,
        action: 'review.unpublished',
        subjectType: 'review',
        subjectId: reviewId,
        data: { slug: publication.slug, reason },
      },
      transaction,
    );
  });
  const latest = await PublishedVersion.findOne({
    where: { publicationId: publication.id, number: publication.latestNumber },
  });
  if (latest) await afterChange(publication, latest.snapshot as never);
  return { slug: publication.slug, withdrawn: { at: publication.withdrawnAt!.toISOString(), reason } };
}

/**
 * Refreshes the verdict search document and the team's workbench index. The page itself is read
 * from the database on every render; shared caches keep it at most a second (docs/deployment.md).
 */
async function afterChange(publication: Publication, snapshot: Parameters<typeof verdictDoc>[1]) {
  const team = await Team.findByPk(publication.teamId, { attributes: ['name'] });
  await upsertVerdict(verdictDoc(listItem(publication, snapshot, team?.name ?? snapshot.team.name), snapshot));
  await onReviewChanged(publication.reviewId);
}

/** After a review is deleted its publication goes with it (foreign key); drop it from the verdict search too. */
export async function onPublicationGone(slug: string): Promise<void> {
  await removeVerdict(slug);
}

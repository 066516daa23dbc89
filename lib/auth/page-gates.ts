import { notFound, redirect } from 'next/navigation';
import { cache } from 'react';
import { studyById } from '@/lib/library/studies';
import { reviewAccess } from '@/lib/reviews/queries';
import { roundAccess } from '@/lib/rounds/access';
import { listRounds } from '@/lib/rounds/queries';
import { idParam } from '@/lib/validation/ids';
import { requirePageActor } from './current';
import { decide } from './policy';

/**
 * The existence and access checks of the signed-in pages with an id in the path. Each runs in
 * the layout of its segment as well as in its page (once per request: React's cache). The layout
 * sits outside the segment's loading.js, the Suspense boundary whose fallback is sent at once with
 * status 200; a notFound() there comes before anything is sent, so a missing or another team's
 * review, study or round answers with status 404 (Next.js docs, loading.js: "Status Codes" —
 * streaming sends its status with the first bytes).
 */

/** Ids in paths are digits only (lib/validation/ids.ts); anything else is a page that does not exist. */
const positive = (raw: string): number => {
  const parsed = idParam.safeParse(raw);
  if (!parsed.success) notFound();
  return parsed.data;
};

/** A review the signed-in person may read; another team's answers like a missing one. */
export const readableReview = cache(async (rawId: string, returnTo: string) => {
  const id = positive(rawId);
  const actor = await requirePageActor(returnTo);
  const access = await reviewAccess(id).catch(() => null);
  if (!access || decide(actor, 'review.read', access) !== 'allow') notFound();
  return { id, actor, access };
});

/** A round's scorecard for a person invited to it; anyone else gets 404. */
export const invitedRound = cache(async (rawId: string, rawRound: string) => {
  const id = positive(rawId);
  const roundId = positive(rawRound);
  const actor = await requirePageActor(`/reviews/${rawId}/round/${rawRound}`);
  const access = await roundAccess(id, roundId, actor.userId).catch(() => null);
  if (!access || decide(actor, 'review.round.scorecard', access) !== 'allow') notFound();
  return { id, roundId, actor, access };
});

/** A study the signed-in person may read; another team's answers like a missing one. */
export const readableStudy = cache(async (rawId: string) => {
  const id = positive(rawId);
  const actor = await requirePageActor(`/library/${rawId}`);
  const study = await studyById(id).catch(() => null);
  if (!study || decide(actor, 'study.read', { teamId: study.teamId }) !== 'allow') notFound();
  return { actor, study };
});

/**
 * The round manager of a review: its author and the team owner. An invited reviewer goes to their
 * scorecard; anyone else gets 404.
 */
export const roundsManagerAccess = cache(async (rawId: string) => {
  const { id, actor, access } = await readableReview(rawId, `/reviews/${rawId}/rounds`);
  if (decide(actor, 'review.round.settle', access) !== 'allow') {
    // Not a manager: listRounds gives only the rounds this person is invited to, newest first.
    const [mine] = (await listRounds(id, actor, access)).rounds;
    if (mine) redirect(`/reviews/${id}/round/${mine.id}`);
    notFound();
  }
  return { id, actor, access };
});

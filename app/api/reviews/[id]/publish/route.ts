import { route } from '@/lib/auth/handler';
import { decide } from '@/lib/auth/policy';
import { publishAccess, publishReview } from '@/lib/publishing/commands';
import { publicationOfReview } from '@/lib/publishing/queries';
import { reviewAccess } from '@/lib/reviews/queries';
import { publishBody, publishParams } from '@/lib/validation/publishing';

// GET /api/reviews/:id/publish — the review's publication (slug, visibility, latest version, withdrawal) or null, and whether the caller may publish it (staff).
export const GET = route({ params: publishParams }, async ({ params, authorize, actor }) => {
  authorize('review.read', await reviewAccess(params.id), 'That review');
  const mayPublish = decide(actor, 'review.publish', await publishAccess(params.id)) === 'allow';
  return { publication: await publicationOfReview(params.id), mayPublish };
});

// POST /api/reviews/:id/publish {visibility, changeNote?} — a new immutable version, mails to followers (owner, or coach where the team allows) → 201 PublishResultDTO.
export const POST = route(
  { params: publishParams, body: publishBody },
  async ({ params, body, authorize, signedIn }) => {
    authorize('review.publish', await publishAccess(params.id), 'That review');
    return Response.json(await publishReview(params.id, signedIn(), body), { status: 201 });
  },
);

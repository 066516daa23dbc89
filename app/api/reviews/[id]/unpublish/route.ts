import { route } from '@/lib/auth/handler';
import { publishAccess, unpublishReview } from '@/lib/publishing/commands';
import { publishParams, unpublishBody } from '@/lib/validation/publishing';

// POST /api/reviews/:id/unpublish {reason} — withdraws the verdict; versions stay and readers see the reason (same people as publish).
export const POST = route(
  { params: publishParams, body: unpublishBody },
  async ({ params, body, authorize, signedIn }) => {
    authorize('review.publish', await publishAccess(params.id), 'That review');
    return unpublishReview(params.id, signedIn(), body.reason);
  },
);

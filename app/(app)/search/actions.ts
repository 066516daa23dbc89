'use server';

import { z } from 'zod';
import { formAction } from '@/lib/auth/action';
import { reviewAccess } from '@/lib/reviews/queries';
import { copyMechanism } from '@/lib/reviews/copy-mechanism';
import { idParam } from '@/lib/validation/reviews';

const copySchema = z.object({ mechanismId: idParam, sourceReviewId: idParam, targetReviewId: idParam });

// Copies a past review's mechanism (with its appraisals) into the review being written.
// The target's freeze (an open round) is checked by copyMechanism itself, in its write transaction.
export const copyMechanismAction = formAction(copySchema, async (data, { authorize }) => {
  authorize('review.read', await reviewAccess(data.sourceReviewId), 'That review');
  authorize('review.update', await reviewAccess(data.targetReviewId), 'That review');
  const { appraisals } = await copyMechanism(data.mechanismId, data.targetReviewId);
  return { ok: true, message: `Copied, with ${appraisals} ${appraisals === 1 ? 'appraisal' : 'appraisals'}.` };
});

import { assertSeesScores } from '@/lib/rounds/freeze';
import { route } from '@/lib/auth/handler';
import { reviewAccess, reviewMetaAnalysis } from '@/lib/reviews/queries';
import { metaAnalysisQuery, reviewParams } from '@/lib/validation/reviews';

// GET /api/reviews/:id/meta-analysis?mechanism=<id>|outcome[&measure=] — pooled effect and forest-plot rows (staff) → MetaAnalysisDTO; 400 with fewer than two.
export const GET = route(
  { params: reviewParams, query: metaAnalysisQuery },
  async ({ params, query, authorize, signedIn }) => {
    authorize('review.read', await reviewAccess(params.id), 'That review');
    await assertSeesScores(signedIn().userId, params.id);
    return reviewMetaAnalysis(params.id, query.mechanism, query.measure);
  },
);

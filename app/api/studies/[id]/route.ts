import { onStudyChanged } from '@/lib/search/index-store';
import { route } from '@/lib/auth/handler';
import { deleteStudy, studyById, studyDetail, updateStudy } from '@/lib/library/studies';
import { deleteStudyQuery, studyParams, updateStudySchema } from '@/lib/validation/studies';

// GET /api/studies/:id — the study and its appraisals across the team's reviews (staff) → { study, appraisals }.
export const GET = route({ params: studyParams }, async ({ params, authorize, signedIn }) => {
  const study = await studyById(params.id);
  authorize('study.read', { teamId: study.teamId }, 'That study');
  return studyDetail(study, signedIn().userId);
});

// PATCH /api/studies/:id — reference and appraisal fields (owner, coach) → { study }.
export const PATCH = route(
  { params: studyParams, body: updateStudySchema },
  async ({ params, body, authorize, signedIn }) => {
    const study = await studyById(params.id);
    authorize('study.write', { teamId: study.teamId }, 'That study');
    const updated = await updateStudy(study, signedIn().userId, body);
    await onStudyChanged(study.id);
    return { study: updated };
  },
);

// DELETE /api/studies/:id[?force=1] — (owner, coach) → { study, deletedAppraisals }; used by appraisals and not forced → 409 { error, appraisalCount, reviews }.
export const DELETE = route(
  { params: studyParams, query: deleteStudyQuery },
  async ({ params, query, authorize, signedIn }) => {
    const study = await studyById(params.id);
    authorize('study.write', { teamId: study.teamId }, 'That study');
    const outcome = await deleteStudy(study, signedIn().userId, query.force === '1');
    if (!outcome.ok) return Response.json(outcome.body, { status: 409 });
    await onStudyChanged(study.id);
    return { study: outcome.study, deletedAppraisals: outcome.deletedAppraisals };
  },
);

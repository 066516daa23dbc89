import { route } from '@/lib/auth/handler';
import { attachPdf, MAX_PDF_BYTES, pdfResponse, removePdf } from '@/lib/library/files';
import { studyById } from '@/lib/library/studies';
import { fileField, readLimitedFormData } from '@/lib/library/upload';
import { studyParams } from '@/lib/validation/studies';

// GET /api/studies/:id/file — streams the study's PDF (staff of the team only).
export const GET = route({ params: studyParams }, async ({ params, authorize }) => {
  const study = await studyById(params.id);
  authorize('study.read', { teamId: study.teamId }, 'That study');
  return pdfResponse(study);
});

// POST /api/studies/:id/file — multipart `file`, a PDF ≤ 20 MB checked by its %PDF- header (owner, coach) → { study }; 413 too large, 415 not a PDF.
export const POST = route({ params: studyParams, multipart: true }, async ({ req, params, authorize, signedIn }) => {
  const study = await studyById(params.id);
  authorize('study.write', { teamId: study.teamId }, 'That study');
  const form = await readLimitedFormData(req, MAX_PDF_BYTES, 'PDF');
  return { study: await attachPdf(study, signedIn().userId, fileField(form, 'PDF')) };
});

// DELETE /api/studies/:id/file — removes the PDF (owner, coach) → { study }.
export const DELETE = route({ params: studyParams }, async ({ params, authorize, signedIn }) => {
  const study = await studyById(params.id);
  authorize('study.write', { teamId: study.teamId }, 'That study');
  return { study: await removePdf(study, signedIn().userId) };
});

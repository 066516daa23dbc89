import { route } from '@/lib/auth/handler';
import { formatReference } from '@/lib/citations/format';
import { studyById } from '@/lib/library/studies';
import { citationQuery, studyParams } from '@/lib/validation/studies';

// GET /api/studies/:id/citation?format=apa|bibtex|ris|csl[&download=1] — the reference (staff) → CitationDTO, or the file itself with download=1.
export const GET = route({ params: studyParams, query: citationQuery }, async ({ params, query, authorize }) => {
  const study = await studyById(params.id);
  authorize('study.read', { teamId: study.teamId }, 'That study');
  const reference = formatReference(study.csl, query.format);
  if (query.download !== '1') return reference;
  return new Response(reference.text, {
    headers: {
      'content-type': reference.mediaType,
      'content-disposition': `attachment; filename="${reference.filename}"`,
      'cache-control': 'private, no-store',
    },
  });
});

import { z } from 'zod';
import { route } from '@/lib/auth/handler';
import { verdictPage } from '@/lib/publishing/queries';

const params = z.object({ slug: z.string().regex(/^[a-z0-9-]{1,100}$/, { error: 'Not a verdict address.' }) });
const query = z.object({
  format: z.enum(['bibtex', 'ris'], { error: 'Format is bibtex or ris.' }),
  version: z.coerce.number().int().positive().optional(),
});

// GET /v/:slug/references?format=bibtex|ris[&version=] — the verdict's reference list as a file (same readers as the page).
export const GET = route({ params, query, auth: 'optional' }, async ({ params, query, actor }) => {
  const page = await verdictPage(params.slug, actor, query.version);
  const refs = page.snapshot.references;
  const text = refs.map((r) => (query.format === 'bibtex' ? r.bibtex : r.ris).trim()).join('\n\n') + '\n';
  const ext = query.format === 'bibtex' ? 'bib' : 'ris';
  return new Response(text, {
    headers: {
      'content-type':
        query.format === 'bibtex'
          ? 'application/x-bibtex; charset=utf-8'
          : 'application/x-research-info-systems; charset=utf-8',
      'content-disposition': `attachment; filename="${page.slug}-v${page.version.number}.${ext}"`,
    },
  });
});

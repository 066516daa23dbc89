import { reindexStudies } from '@/lib/search/index-store';
import { route } from '@/lib/auth/handler';
import { importSource } from '@/lib/library/import';
import { importResponse } from '@/lib/library/respond';
import { createStudyByHand, listStudies, studyMetaOf } from '@/lib/library/studies';
import { createStudySchema, studyListQuery } from '@/lib/validation/studies';

// GET /api/studies — the evidence library of the caller's teams (staff); ?teamId&q&design&tag&sort&page&pageSize → { studies, total, page, pageSize }.
export const GET = route({ query: studyListQuery }, async ({ query, authorize, signedIn }) => {
  if (query.teamId !== undefined) authorize('study.read', { teamId: query.teamId }, 'That team');
  return listStudies(signedIn(), query);
});

// POST /api/studies — { teamId, source } (DOI, BibTeX, RIS or CSL-JSON) or { teamId, title, … } by hand (owner, coach)
// → 201 (something added) or 200 { results: ImportResultDTO[], studies }; Accept: application/x-ndjson streams progress.
export const POST = route({ body: createStudySchema }, async ({ req, body, authorize, signedIn }) => {
  authorize('study.write', { teamId: body.teamId }, 'That team');
  const { userId } = signedIn();
  const meta = studyMetaOf(body);
  if (body.source === undefined) {
    const created = await createStudyByHand(body.teamId, userId, { ...body, ...meta });
    await reindexStudies(created);
    return Response.json(created, { status: created.results[0].status === 'added' ? 201 : 200 });
  }
  const source = body.source;
  return importResponse(req, async (onProgress) =>
    reindexStudies(await importSource(body.teamId, userId, source, { meta, onProgress })),
  );
});

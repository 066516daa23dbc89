import { reindexStudies } from '@/lib/search/index-store';
import { route } from '@/lib/auth/handler';
import { importFile, MAX_IMPORT_BYTES } from '@/lib/library/import';
import { importResponse } from '@/lib/library/respond';
import { fileField, readLimitedFormData } from '@/lib/library/upload';
import { importFormSchema } from '@/lib/validation/studies';

// POST /api/studies/import — multipart: `file` (.bib, .ris or .json, ≤ 10 MB) and `teamId` (owner, coach)
// → 201/200 { results: ImportResultDTO[], studies }; Accept: application/x-ndjson streams progress lines first.
export const POST = route({ multipart: true }, async ({ req, authorize, signedIn }) => {
  const form = await readLimitedFormData(req, MAX_IMPORT_BYTES, 'library file');
  const { teamId } = importFormSchema.parse({ teamId: form.get('teamId') ?? undefined });
  authorize('study.write', { teamId }, 'That team');
  const file = fileField(form, 'library file');
  const { userId } = signedIn();
  return importResponse(req, async (onProgress) =>
    reindexStudies(await importFile(teamId, userId, file, { onProgress })),
  );
});

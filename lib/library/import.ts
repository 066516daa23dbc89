import { Op } from 'sequelize';
import { AppError } from '@/lib/api/errors';
import { recordEvent } from '@/lib/audit/record';
import type { CslItem } from '@/lib/citations/csl';
import { lookupDoi, type DoiLookup } from '@/lib/citations/doi';
import { formatFromFilename, splitSource, type ParsedEntry, type SourceFormat } from '@/lib/citations/parse';
import { uniqueOrConflict, writeTransaction } from '@/lib/reviews/transaction';
import type { ImportResultDTO, StudyDTO } from '@/lib/reviews/types';
import type { StudyMetaInput } from '@/lib/validation/studies';
import { Study } from '@/models';
import { referenceColumns } from './columns';
import { toStudyDTO } from './dto';
import { insertStudies, type StudyRow } from './import-insert';
import { appraisalCounts, newStudyRow } from './studies';

/**
 * Bringing references into a team's library from pasted text or an uploaded file: parse
 * (citation-js, offline), look DOIs up, drop what the library already has, and add the rest.
 * Every entry gets its own result — added, duplicate (with the study it matched) or failed (with
 * why) — and a failed entry never leaves half a study behind.
 *
 * Built to cost little beside the parse itself (bench/import.ts measures both): the library's
 * DOIs and fingerprints are read once and duplicates found in memory, and the new studies are
 * written in chunks, one transaction and one multi-row insert per chunk, so the database work
 * grows with the number of chunks rather than of entries and a long import never holds the
 * write lock for long (docs/architecture.md, "Import").
 */

/** Largest import in one request; a 2,000-entry library is the case we measure (bench/import.ts). */
export const MAX_IMPORT_ENTRIES = 5000;
/** Largest .bib / .ris / .json upload. */
export const MAX_IMPORT_BYTES = 10 * 1024 * 1024;
const PARSE_BATCH = 100;
/** Rows per insert and transaction: 500 × 22 columns stays under SQLite's 32,766 bound variables. */
const INSERT_BATCH = 500;
const LOOKUP_CONCURRENCY = 4;
/** IN lists stay far below SQLite's bound-variable limit. */
const QUERY_CHUNK = 500;

export interface ImportProgress {
  phase: 'reading' | 'looking-up' | 'saving' | 'done';
  done: number;
  total: number;
}

export interface ImportOptions {
  format?: SourceFormat | null;
  /** Appraisal fields (design, population …) to set on every added study. */
  meta?: StudyMetaInput;
  onProgress?: (progress: ImportProgress) => void;
  /** The DOI lookup (tests pass a stub; the default asks DOI_BASE_URL). */
  lookup?: (doi: string) => Promise<DoiLookup>;
}

export interface ImportResult {
  results: ImportResultDTO[];
  /** Every study an entry resolved to: the added ones and the ones already in the library. */
  studies: StudyDTO[];
  format: SourceFormat | null;
}

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

async function inChunks<T, R>(items: T[], size: number, run: (chunk: T[]) => Promise<R[]>): Promise<R[]> {
  const out: R[] = [];
  for (let i = 0; i < items.length; i += size) out.push(...(await run(items.slice(i, i + size))));
  return out;
}

/** What a duplicate check needs of a library study. */
type Known = Pick<Study, 'id' | 'doi' | 'fingerprint' | 'citation' | 'title'>;

/**
 * The team's library by DOI and by fingerprint, read in one query of five columns: a library of
 * ten thousand studies is a few hundred kilobytes, and every entry is then checked in memory.
 */
async function libraryKeys(teamId: number): Promise<{ byDoi: Map<string, Known>; byFingerprint: Map<string, Known> }> {
  const rows = await Study.findAll({
    where: { teamId },
    attributes: ['id', 'doi', 'fingerprint', 'citation', 'title'],
    order: [['id', 'ASC']],
    raw: true,
  });
  const byDoi = new Map<string, Known>();
  const byFingerprint = new Map<string, Known>();
  for (const row of rows as unknown as Known[]) {
    if (row.doi && !byDoi.has(row.doi)) byDoi.set(row.doi, row);
    if (!byFingerprint.has(row.fingerprint)) byFingerprint.set(row.fingerprint, row);
  }
  return { byDoi, byFingerprint };
}

export async function importSource(
  teamId: number,
  userId: number,
  text: string,
  options: ImportOptions = {},
): Promise<ImportResult> {
  const progress = options.onProgress ?? (() => {});
  const lookup = options.lookup ?? ((doi: string) => lookupDoi(doi));
  const split = splitSource(text, options.format ?? undefined);
  const total = split.entries.length;
  if (total > MAX_IMPORT_ENTRIES) {
    throw new AppError(
      'too_large',
      `That is ${total.toLocaleString('en')} entries; import at most ${MAX_IMPORT_ENTRIES.toLocaleString('en')} at a time.`,
    );
  }

  // 1. Parse, in batches, reporting progress between them.
  const entries: ParsedEntry[] = [];
  for (let i = 0; i < total; i += PARSE_BATCH) {
    for (const parse of split.entries.slice(i, i + PARSE_BATCH)) entries.push(parse());
    progress({ phase: 'reading', done: entries.length, total });
    await yieldToEventLoop();
  }

  const results: (ImportResultDTO | null)[] = new Array(total).fill(null);
  const matched = new Set<number>();
  const library = await libraryKeys(teamId);
  const duplicateOf = (index: number, study: Known): ImportResultDTO => {
    matched.add(study.id);
    return {
      index,
      title: study.title,
      status: 'duplicate',
      studyId: study.id,
      reason: `Already in the library as ${study.citation}.`,
    };
  };

  // 2. DOIs: one already in the library needs no lookup; the others are looked up a few at a time.
  const pending: Extract<ParsedEntry, { kind: 'doi' }>[] = [];
  for (const entry of entries) {
    if (entry.kind !== 'doi') continue;
    const study = library.byDoi.get(entry.doi);
    if (study) results[entry.index] = duplicateOf(entry.index, study);
    else pending.push(entry);
  }
  let looked = 0;
  let next = 0;
  const worker = async () => {
    while (next < pending.length) {
      const entry = pending[next++];
      const answer = await lookup(entry.doi);
      // Entries sit at their index (splitSource keeps the order).
      entries[entry.index] = answer.ok
        ? { kind: 'parsed', index: entry.index, csl: answer.csl }
        : { kind: 'failed', index: entry.index, title: entry.doi, reason: answer.reason };
      looked += 1;
      progress({ phase: 'looking-up', done: looked, total: pending.length });
    }
  };
  await Promise.all(Array.from({ length: Math.min(LOOKUP_CONCURRENCY, pending.length) }, worker));

  for (const entry of entries) {
    if (entry.kind === 'failed')
      results[entry.index] = { index: entry.index, title: entry.title, status: 'failed', reason: entry.reason };
  }

  // 3. What the library already has, and repeats within this import, found in memory.
  const firstInImport = new Map<string, number>();
  const repeats: { index: number; title: string; firstIndex: number }[] = [];
  const toAdd: { index: number; csl: CslItem; columns: ReturnType<typeof referenceColumns> }[] = [];
  for (const entry of entries) {
    if (entry.kind !== 'parsed') continue;
    const columns = referenceColumns(entry.csl);
    const key = columns.doi ? `doi:${columns.doi}` : `fp:${columns.fingerprint}`;
    const existing = columns.doi ? library.byDoi.get(columns.doi) : library.byFingerprint.get(columns.fingerprint);
    if (existing && !results[entry.index]) results[entry.index] = duplicateOf(entry.index, existing);
    else if (firstInImport.has(key))
      repeats.push({ index: entry.index, title: columns.title, firstIndex: firstInImport.get(key)! });
    else {
      firstInImport.set(key, entry.index);
      toAdd.push({ index: entry.index, csl: entry.csl, columns });
    }
  }

  // 4. Add the new ones, a chunk per transaction: a chunk is saved whole or not at all.
  const added = new Map<number, StudyRow>();
  for (let i = 0; i < toAdd.length; i += INSERT_BATCH) {
    const batch = toAdd.slice(i, i + INSERT_BATCH);
    try {
      await uniqueOrConflict(
        'Another import added some of these studies at the same moment; import again to see which are new.',
        () =>
          writeTransaction(async (transaction) => {
            const rows = await insertStudies(
              batch.map((p) => newStudyRow(teamId, userId, p.csl, options.meta ?? {}, p.columns)),
              transaction,
            );
            rows.forEach((row, j) => added.set(batch[j].index, row));
          }),
      );
    } catch (error) {
      // A unique-index clash (a concurrent import) fails this chunk alone; anything else is a server fault.
      if (!(error instanceof AppError)) throw error;
      for (const p of batch)
        results[p.index] = { index: p.index, title: p.columns.title, status: 'failed', reason: error.message };
    }
    progress({ phase: 'saving', done: Math.min(i + INSERT_BATCH, toAdd.length), total: toAdd.length });
    await yieldToEventLoop();
  }
  if (added.size)
    await recordEvent({
      teamId,
      actorId: userId,
      action: 'studies.imported',
      subjectType: 'study',
      data: { format: split.format, entries: total, added: added.size },
    });
  for (const r of repeats) {
    const first = added.get(r.firstIndex);
    results[r.index] = first
      ? {
          index: r.index,
          title: r.title,
          status: 'duplicate',
          studyId: first.id,
          reason: `Appears earlier in this import (entry ${r.firstIndex + 1}).`,
        }
      : { index: r.index, title: r.title, status: 'failed', reason: results[r.firstIndex]?.reason ?? 'Not saved.' };
  }
  progress({ phase: 'done', done: total, total });

  // The matches were loaded with a few columns only; the response sends them whole. Only they
  // can have appraisals: the added studies did not exist until this request.
  const matchedRows = await inChunks([...matched], QUERY_CHUNK, (chunk) =>
    Study.findAll({ where: { id: { [Op.in]: chunk } } }),
  );
  const counts = await appraisalCounts(matchedRows.map((row) => row.id));
  const studies = [
    ...[...added.values()].map((row) => toStudyDTO(row)),
    ...matchedRows.map((row) => toStudyDTO(row, counts.get(row.id))),
  ];
  // Each study's suggested design is read once, by toStudyDTO, and the results repeat it: an
  // added study's on its own result, a library study's on the duplicates of it (a repeat
  // within the import points at the earlier entry, which carries it).
  const suggested = new Map(
    studies.map((dto): [number, Pick<ImportResultDTO, 'suggestedDesign'>] => [
      dto.id,
      dto.suggestedDesign ? { suggestedDesign: dto.suggestedDesign } : {},
    ]),
  );
  for (const [index, study] of added)
    results[index] = { index, title: study.title, status: 'added', studyId: study.id, ...suggested.get(study.id) };
  return {
    results: results.map((r, index) =>
      r
        ? { ...r, ...(r.status === 'duplicate' && r.studyId && matched.has(r.studyId) ? suggested.get(r.studyId) : {}) }
        : { index, title: null, status: 'failed', reason: 'Not processed.' },
    ),
    studies,
    format: split.format,
  };
}

/** POST /api/studies/import: the uploaded file's text, its format from the file name. */
export async function importFile(
  teamId: number,
  userId: number,
  file: File,
  options: Omit<ImportOptions, 'format'> = {},
): Promise<ImportResult> {
  const format = formatFromFilename(file.name);
  if (!format) throw new AppError('unsupported_media_type', 'Upload a .bib, .ris or .json (CSL-JSON) file.');
  if (file.size > MAX_IMPORT_BYTES)
    throw new AppError('too_large', 'The file is over 10 MB; split it and import the parts.');
  const text = new TextDecoder('utf-8', { fatal: false }).decode(await file.arrayBuffer()).replace(/^\uFEFF/, '');
  return importSource(teamId, userId, text, { ...options, format });
}

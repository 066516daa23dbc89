import { Op, type Transaction } from 'sequelize';
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
import { newStudyRow, studiesDTO } from './studies';

/**
 * Bringing references into a team's library from pasted text or an uploaded file: parse
 * (citation-js, offline), look DOIs up, drop what the library already has, and add the rest in
 * one transaction. Every entry gets its own result — added, duplicate (with the study it
 * matched) or failed (with why) — and a failed entry never leaves half a study behind.
 */

/** Largest import in one request; a 2,000-entry library is the case we measure (bench/import.ts). */
export const MAX_IMPORT_ENTRIES = 5000;
/** Largest .bib / .ris / .json upload. */
export const MAX_IMPORT_BYTES = 10 * 1024 * 1024;
const PARSE_BATCH = 100;
const INSERT_BATCH = 250;
const LOOKUP_CONCURRENCY = 4;
/** SQLite allows 32,766 bound variables per statement; IN lists stay far below. */
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

async function existingBy(
  teamId: number,
  column: 'doi' | 'fingerprint',
  values: string[],
  transaction?: Transaction,
): Promise<Map<string, Study>> {
  const unique = [...new Set(values)];
  const found = await inChunks(unique, QUERY_CHUNK, (chunk) =>
    Study.findAll({
      where: { teamId, [column]: { [Op.in]: chunk } },
      attributes: ['id', 'doi', 'fingerprint', 'citation', 'title'],
      transaction,
    }),
  );
  const map = new Map<string, Study>();
  for (const study of found) {
    const key = study[column];
    if (key && !map.has(key)) map.set(key, study);
  }
  return map;
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
  const matched = new Map<number, Study>();

  // 2. DOIs: one already in the library needs no lookup; the others are looked up a few at a time.
  const doiEntries = entries.filter((e): e is Extract<ParsedEntry, { kind: 'doi' }> => e.kind === 'doi');
  if (doiEntries.length) {
    const known = await existingBy(
      teamId,
      'doi',
      doiEntries.map((e) => e.doi),
    );
    const pending: Extract<ParsedEntry, { kind: 'doi' }>[] = [];
    for (const entry of doiEntries) {
      const study = known.get(entry.doi);
      if (study) {
        results[entry.index] = {
          index: entry.index,
          title: study.title,
          status: 'duplicate',
          studyId: study.id,
          reason: `Already in the library as ${study.citation}.`,
        };
        matched.set(study.id, study);
      } else pending.push(entry);
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
  }

  for (const entry of entries) {
    if (entry.kind === 'failed')
      results[entry.index] = { index: entry.index, title: entry.title, status: 'failed', reason: entry.reason };
  }

  // 3. What the library already has, and repeats within this import.
  const parsed = entries
    .filter((e): e is Extract<ParsedEntry, { kind: 'parsed' }> => e.kind === 'parsed')
    .map((e) => ({ index: e.index, csl: e.csl as CslItem, columns: referenceColumns(e.csl) }));
  const byDoi = await existingBy(
    teamId,
    'doi',
    parsed.flatMap((p) => (p.columns.doi ? [p.columns.doi] : [])),
  );
  const byFingerprint = await existingBy(
    teamId,
    'fingerprint',
    parsed.filter((p) => !p.columns.doi).map((p) => p.columns.fingerprint),
  );
  const firstInImport = new Map<string, number>();
  const repeats: { index: number; title: string; firstIndex: number }[] = [];
  const toAdd: typeof parsed = [];
  for (const p of parsed) {
    const key = p.columns.doi ? `doi:${p.columns.doi}` : `fp:${p.columns.fingerprint}`;
    const existing = p.columns.doi ? byDoi.get(p.columns.doi) : byFingerprint.get(p.columns.fingerprint);
    if (existing) {
      results[p.index] = {
        index: p.index,
        title: p.columns.title,
        status: 'duplicate',
        studyId: existing.id,
        reason: `Already in the library as ${existing.citation}.`,
      };
      matched.set(existing.id, existing);
    } else if (firstInImport.has(key)) {
      repeats.push({ index: p.index, title: p.columns.title, firstIndex: firstInImport.get(key)! });
    } else {
      firstInImport.set(key, p.index);
      toAdd.push(p);
    }
  }

  // 4. Add the new ones, all or none (a failure here is a server fault, never a half import).
  const added = new Map<number, Study>();
  if (toAdd.length) {
    await uniqueOrConflict(
      'Another import added some of these studies at the same moment; import again to see which are new.',
      () =>
        writeTransaction(async (transaction) => {
          for (let i = 0; i < toAdd.length; i += INSERT_BATCH) {
            const batch = toAdd.slice(i, i + INSERT_BATCH);
            const rows = await Study.bulkCreate(
              batch.map((p) => newStudyRow(teamId, userId, p.csl, options.meta ?? {})),
              { transaction },
            );
            rows.forEach((row, j) => added.set(batch[j].index, row));
            progress({ phase: 'saving', done: Math.min(i + INSERT_BATCH, toAdd.length), total: toAdd.length });
            await yieldToEventLoop();
          }
          await recordEvent(
            {
              teamId,
              actorId: userId,
              action: 'studies.imported',
              subjectType: 'study',
              data: { format: split.format, entries: total, added: toAdd.length },
            },
            transaction,
          );
        }),
    );
  }
  for (const [index, study] of added)
    results[index] = { index, title: study.title, status: 'added', studyId: study.id };
  for (const r of repeats) {
    const first = added.get(r.firstIndex)!;
    results[r.index] = {
      index: r.index,
      title: r.title,
      status: 'duplicate',
      studyId: first.id,
      reason: `Appears earlier in this import (entry ${r.firstIndex + 1}).`,
    };
  }
  progress({ phase: 'done', done: total, total });

  // The matches were loaded with a few columns only; the response sends them whole.
  const matchedRows = await inChunks([...matched.keys()], QUERY_CHUNK, (chunk) =>
    Study.findAll({ where: { id: { [Op.in]: chunk } } }),
  );
  const studies = await studiesDTO([...added.values(), ...matchedRows]);
  return {
    results: results.map((r, index) => r ?? { index, title: null, status: 'failed', reason: 'Not processed.' }),
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

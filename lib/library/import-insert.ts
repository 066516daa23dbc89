import type { InferAttributes, Transaction } from 'sequelize';
import { db, isPostgres } from '@/lib/db';
import type { Study } from '@/models';
import type { newStudyRow } from './studies';

/** A library row as plain data: what a model instance holds, without the instance. */
export type StudyRow = InferAttributes<Study>;

type NewRow = ReturnType<typeof newStudyRow>;

/**
 * A date as Sequelize writes a DATE column (UTC, `YYYY-MM-DD HH:mm:ss.SSS +00:00`), so rows
 * written here read back exactly like rows written through the model.
 */
const dateColumn = (date: Date) => {
  const iso = date.toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, 23)} +00:00`;
};

/**
 * One multi-row INSERT of new studies, inside the caller's write transaction; the rows come
 * back with their ids, in the order given.
 *
 * Why not `Study.bulkCreate`: it builds a model instance per row and runs every value through
 * its column type (a moment.js date format per timestamp, a type check per value) before
 * escaping — for a 500-row chunk several times what SQLite needs to store it, and on a file of
 * small entries more than citation-js needs to read them (bench/import.ts). Here the values are
 * made ready once (JSON columns stringified, both timestamps one string) and only escaped.
 */
export async function insertStudies(rows: NewRow[], transaction: Transaction): Promise<StudyRow[]> {
  if (!rows.length) return [];
  const now = new Date();
  const stamp = dateColumn(now);
  const records = rows.map((row) => ({
    ...row,
    csl: JSON.stringify(row.csl),
    effect: row.effect === null ? null : JSON.stringify(row.effect),
    tags: JSON.stringify(row.tags),
    createdAt: stamp,
    updatedAt: stamp,
  }));
  // `returning` is read by PostgreSQL's query generator (Sequelize's types leave it out).
  const options = { transaction, returning: ['id'] };
  const inserted = (await db().getQueryInterface().bulkInsert('studies', records, options)) as unknown;
  const ids = insertedIds(inserted, rows.length);
  return rows.map((row, i) => ({
    ...row,
    id: ids[i],
    evidenceNotice: null,
    createdAt: now,
    updatedAt: now,
  }));
}

/**
 * The ids of one multi-row INSERT's rows, in order. PostgreSQL answers with the RETURNING rows.
 * SQLite answers with the last rowid: the statement's rows took consecutive ids ending there,
 * since the write transaction holds the file's only write lock (Sequelize's own bulkCreate
 * reads SQLite's ids the same way).
 */
function insertedIds(inserted: unknown, count: number): number[] {
  if (isPostgres()) return (inserted as { id: number | string }[]).map((row) => Number(row.id));
  if (typeof inserted !== 'number') throw new Error('SQLite gave no rowid for the inserted studies.');
  return Array.from({ length: count }, (_, i) => inserted - count + 1 + i);
}

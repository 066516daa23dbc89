import { UniqueConstraintError, type InferAttributes, type Transaction } from 'sequelize';
import type { Database, RunResult } from 'sqlite3';
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

/** Columns stored as JSON text (the model's DataTypes.JSON), stringified once here. */
const JSON_COLUMNS = new Set(['csl', 'effect', 'tags']);

/** A value as the column stores it: JSON columns as their text, a null JSON value as NULL. */
const stored = (key: string, value: unknown) =>
  JSON_COLUMNS.has(key) && value !== null && value !== undefined ? JSON.stringify(value) : (value ?? null);

/**
 * One multi-row INSERT of new studies, inside the caller's write transaction; the rows come
 * back with their ids, in the order given.
 *
 * Why not `Study.bulkCreate`: it builds a model instance per row and runs every value through
 * its column type (a moment.js date format per timestamp, a type check per value) before
 * escaping — for a 500-row chunk several times what SQLite needs to store it, and on a file of
 * small entries more than citation-js needs to read them (bench/import.ts). Here the values are
 * made ready once (JSON columns stringified, both timestamps one string).
 */
export async function insertStudies(rows: NewRow[], transaction: Transaction): Promise<StudyRow[]> {
  if (!rows.length) return [];
  const now = new Date();
  const stamp = dateColumn(now);
  const ids = isPostgres()
    ? await insertPostgres(rows, stamp, transaction)
    : await insertSqlite(rows, stamp, transaction);
  return rows.map((row, i) => ({
    ...row,
    id: ids[i],
    evidenceNotice: null,
    createdAt: now,
    updatedAt: now,
  }));
}

/** PostgreSQL: Sequelize's multi-row INSERT … RETURNING id, which answers with the rows in order. */
async function insertPostgres(rows: NewRow[], stamp: string, transaction: Transaction): Promise<number[]> {
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
  return (inserted as { id: number | string }[]).map((row) => Number(row.id));
}

/**
 * SQLite: one statement with the values bound (`?NNN`), run on the transaction's own connection.
 *
 * Sequelize would write every value into the SQL text instead — escaped, then the whole
 * statement (megabytes for a chunk of abstracts) lower-cased and scanned several times while it
 * classifies the query, and parsed again by SQLite — and its bind parameters are named (`$1` …),
 * which SQLite looks up one by one in a list (sqlite3_bind_parameter_index): quadratic in a
 * statement of thousands. Bound values are stored as Sequelize's literals were (a boolean as 0/1,
 * text as text). A column whose value is the same in every row of the chunk (the team, the
 * author, the appraisal fields given for the whole import, the timestamps) is bound once and
 * named by its number in every row (https://www.sqlite.org/lang_expr.html#parameters): binding
 * costs the driver a conversion and a copy per value, and these are most of a row's columns.
 *
 * The ids: SQLite answers with the last rowid, and the statement's rows took consecutive ids
 * ending there, since the write transaction holds the file's only write lock (Sequelize's own
 * bulkCreate reads SQLite's ids the same way).
 */
async function insertSqlite(rows: NewRow[], stamp: string, transaction: Transaction): Promise<number[]> {
  const keys = Object.keys(rows[0]) as (keyof NewRow)[];
  const columns = [...keys.map(String), 'createdAt', 'updatedAt'];
  const table = rows.map((row) => [...keys.map((key) => stored(key, row[key])), stamp, stamp]);
  const values: unknown[] = [];
  // For each column, the parameter number all rows share, or null when the rows differ.
  const shared = columns.map((_, c) => {
    const first = table[0][c];
    if (!table.every((row) => row[c] === first)) return null;
    values.push(first);
    return values.length;
  });
  const tuples = table.map(
    (row) =>
      `(${row
        .map((value, c) => {
          if (shared[c] !== null) return `?${shared[c]}`;
          values.push(value);
          return `?${values.length}`;
        })
        .join(',')})`,
  );
  const sql = `INSERT INTO \`studies\` (${columns.map((c) => `\`${c}\``).join(',')}) VALUES ${tuples.join(',')};`;
  const connection = (transaction as unknown as { connection: Database }).connection;
  const lastId = await new Promise<number>((resolve, reject) =>
    connection.run(sql, values, function (this: RunResult, error: Error | null) {
      if (error) reject(asSequelizeError(error));
      else resolve(this.lastID);
    }),
  );
  if (typeof lastId !== 'number') throw new Error('SQLite gave no rowid for the inserted studies.');
  return Array.from({ length: rows.length }, (_, i) => lastId - rows.length + 1 + i);
}

/** A unique index clash as the UniqueConstraintError Sequelize raises for it, so callers catch one kind. */
function asSequelizeError(error: Error & { code?: string }): Error {
  if (error.code === 'SQLITE_CONSTRAINT' && /UNIQUE constraint failed/.test(error.message))
    return new UniqueConstraintError({ message: error.message, parent: error as never });
  return error;
}

import { Op, literal, type WhereOptions } from 'sequelize';
import { db } from '@/lib/db';

/**
 * The two library filters that Sequelize's operators cannot say on both engines, as
 * `id IN (subquery)` conditions. The subqueries name the table by its table name (`studies`),
 * never by the alias Sequelize gives the model in the outer query, and run on SQLite and
 * PostgreSQL alike.
 */

const SEARCHED_COLUMNS = ['title', 'citation', 'doi', 'journal', 'outcome'] as const;

/** The search text as a LIKE pattern, its own % _ and \ escaped with \ (declared by ESCAPE on both engines). */
export const likePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** Studies whose title, citation, DOI, journal or outcome contains the text, ignoring case. */
export function studyTextMatches(q: string): WhereOptions {
  const pattern = db().escape(likePattern(q).toLowerCase());
  const quote = (column: string) => db().getQueryInterface().quoteIdentifier(column);
  // LOWER on both sides: SQLite's LIKE ignores ASCII case, PostgreSQL's does not.
  const any = SEARCHED_COLUMNS.map((c) => `LOWER(${quote(c)}) LIKE ${pattern} ESCAPE '\\'`).join(' OR ');
  return { id: { [Op.in]: literal(`(SELECT id FROM studies WHERE ${any})`) } };
}

/** Studies that carry the tag (an element of the JSON array in `tags`). */
export function studyHasTag(tag: string): WhereOptions {
  const value = db().escape(tag);
  const elements =
    db().getDialect() === 'postgres'
      ? `SELECT id FROM studies, json_array_elements_text(studies.tags) AS t(value) WHERE t.value = ${value}`
      : `SELECT studies.id FROM studies, json_each(studies.tags) AS t WHERE t.value = ${value}`;
  return { id: { [Op.in]: literal(`(${elements})`) } };
}

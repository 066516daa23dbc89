import { normalizeDoi } from './doi';
import { foldSpaces } from './rich-text';

/**
 * Reading and writing CSL-JSON items (the Citation Style Language's data format, as citation-js
 * produces it). The library stores each study's reference as one CSL item; these helpers pull
 * out the columns the library sorts and searches by, and build an item from a hand-typed form.
 */

export type CslItem = Record<string, unknown>;
export interface CslName {
  family?: string;
  given?: string;
  literal?: string;
}

const text = (value: unknown): string | null => {
  if (typeof value === 'string') return value.trim() || null;
  if (typeof value === 'number') return String(value);
  if (Array.isArray(value)) return text(value[0]);
  return null;
};

export function cslTitle(csl: CslItem): string | null {
  return text(csl.title);
}

export function cslJournal(csl: CslItem): string | null {
  return text(csl['container-title']);
}

/** The year of `issued` (date-parts, raw or literal), else null. */
export function cslYear(csl: CslItem): number | null {
  const issued = csl.issued as { 'date-parts'?: unknown[][]; raw?: unknown; literal?: unknown } | undefined;
  if (!issued || typeof issued !== 'object') return null;
  const first = Array.isArray(issued['date-parts']) ? issued['date-parts'][0] : undefined;
  const fromParts = Array.isArray(first) ? Number(first[0]) : NaN;
  if (Number.isInteger(fromParts) && fromParts > 0) return fromParts;
  const loose = text(issued.raw) ?? text(issued.literal);
  const match = loose?.match(/\b(1[5-9]\d\d|2\d\d\d)\b/);
  return match ? Number(match[1]) : null;
}

export function cslNames(csl: CslItem, role: 'author' | 'editor' = 'author'): CslName[] {
  const list = csl[role];
  if (!Array.isArray(list)) return [];
  return list.filter(
    (n): n is CslName =>
      typeof n === 'object' && n !== null && (typeof n.family === 'string' || typeof n.literal === 'string'),
  );
}

/**
 * Title + year reduced to letters and digits, to recognise the same work without a DOI
 * (pasted twice, or once from BibTeX and once from RIS).
 */
export function fingerprint(title: string, year: number | null): string {
  const letters = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, ' ')
    .trim()
    .slice(0, 280);
  return `${year ?? 'nd'}:${letters}`;
}

/**
 * An item fit to store: citation-js's bookkeeping (`_graph`) removed, a type, a trimmed title,
 * and the DOI normalized (or dropped when it is not one).
 */
export function cleanCsl(item: CslItem): CslItem {
  const clean: CslItem = {};
  for (const [key, value] of Object.entries(item)) {
    if (key.startsWith('_') || value === undefined || value === null || value === '') continue;
    clean[key] = value;
  }
  if (typeof clean.type !== 'string' || !clean.type) clean.type = 'article-journal';
  const title = cslTitle(clean);
  if (title) clean.title = foldSpaces(title);
  if (clean.DOI !== undefined) {
    const doi = typeof clean.DOI === 'string' ? normalizeDoi(clean.DOI) : null;
    if (doi) clean.DOI = doi;
    else delete clean.DOI;
  }
  return clean;
}

export interface ReferenceFields {
  title?: string;
  authors?: ({ family: string; given?: string } | { literal: string })[];
  year?: number | null;
  journal?: string | null;
  volume?: string | null;
  issue?: string | null;
  pages?: string | null;
  doi?: string | null;
  url?: string | null;
}

/**
 * Merges hand-typed reference fields into a CSL item (a new one when `base` is empty). A null
 * clears the field; an absent key leaves it.
 */
export function applyReferenceFields(base: CslItem, fields: ReferenceFields): CslItem {
  const item: CslItem = { ...base };
  const set = (key: string, value: unknown) => {
    if (value === undefined) return;
    if (value === null || value === '') delete item[key];
    else item[key] = value;
  };
  set('title', fields.title);
  if (fields.authors !== undefined) {
    set(
      'author',
      fields.authors.length
        ? fields.authors.map((a) =>
            'literal' in a ? { literal: a.literal } : { family: a.family, ...(a.given ? { given: a.given } : {}) },
          )
        : null,
    );
  }
  if (fields.year !== undefined) set('issued', fields.year === null ? null : { 'date-parts': [[fields.year]] });
  set('container-title', fields.journal);
  set('volume', fields.volume);
  set('issue', fields.issue);
  // CSL page ranges use a hyphen; the style prints the en dash APA wants.
  set(
    'page',
    fields.pages === undefined || fields.pages === null ? fields.pages : fields.pages.replace(/\s*[–—-]+\s*/g, '-'),
  );
  set('DOI', fields.doi);
  set('URL', fields.url);
  if (!item.type) item.type = 'article-journal';
  return cleanCsl(item);
}

/** A BibTeX-friendly key for an item that has none: family name of the first author + year + first title word. */
export function citationKey(csl: CslItem): string {
  const first = cslNames(csl)[0];
  const name =
    (first?.family ?? first?.literal ?? 'anon')
      .normalize('NFKD')
      .replace(/[^A-Za-z]/g, '')
      .toLowerCase() || 'anon';
  const word =
    (cslTitle(csl) ?? '')
      .normalize('NFKD')
      .toLowerCase()
      .match(/[a-z]{3,}/)?.[0] ?? 'untitled';
  return `${name}${cslYear(csl) ?? 'nd'}${word}`;
}

import { bibtexEntries } from './bibtex';
import type { CslItem } from './csl';
import { normalizeDoi } from './doi';
import { FORCED_TYPES, plugins } from './engine';
import { accept, at, failure, linesAt, nothingFound, type ParsedEntry } from './entry';

/**
 * Turning pasted or uploaded library text into CSL-JSON items, one result per entry, so one
 * broken entry in a 2,000-entry file fails alone with a reason instead of failing the file.
 * Parsing is offline (citation-js); DOIs are only recognised here and looked up by the caller.
 */

export type SourceFormat = 'doi' | 'bibtex' | 'ris' | 'csl-json';

export type { ParsedEntry };
export { lowerHyphenatedParts, splitBibtex } from './bibtex';

export interface ParsedSource {
  format: SourceFormat | null;
  entries: ParsedEntry[];
}

/** Files saved by Windows tools often start with a byte-order mark, which is not text. */
const withoutBom = (text: string) => text.replace(/^\uFEFF/, '');

const BIBTEX_ENTRY_START = /^[ \t]*@[A-Za-z]+[ \t]*[{(]/m;
const RIS_START = /^TY {1,2}- ?/m;

/**
 * What the text looks like: CSL-JSON (starts with [ or {), BibTeX (an @type{ line), RIS (a TY
 * tag line), or a list of DOIs (every word a DOI); null when none of these.
 */
export function detectFormat(text: string): SourceFormat | null {
  const trimmed = withoutBom(text).trim();
  if (!trimmed) return null;
  if (trimmed.startsWith('[') || trimmed.startsWith('{')) return 'csl-json';
  if (BIBTEX_ENTRY_START.test(trimmed)) return 'bibtex';
  if (RIS_START.test(trimmed)) return 'ris';
  const words = trimmed.split(/[\s,;]+/).filter(Boolean);
  if (words.length && words.every((w) => normalizeDoi(w) !== null)) return 'doi';
  return null;
}

export function formatFromFilename(name: string): Exclude<SourceFormat, 'doi'> | null {
  const ext = name.toLowerCase().match(/\.([a-z]+)$/)?.[1];
  if (ext === 'bib' || ext === 'bibtex') return 'bibtex';
  if (ext === 'ris') return 'ris';
  if (ext === 'json') return 'csl-json';
  return null;
}

/**
 * The entries of a text, each parsed only when its thunk is called, so a long import can parse
 * in batches and report progress in between (lib/library/import.ts).
 */
export interface SplitSource {
  format: SourceFormat | null;
  entries: (() => ParsedEntry)[];
}

export function splitSource(source: string, format: SourceFormat | null = detectFormat(source)): SplitSource {
  const text = withoutBom(source);
  switch (format) {
    case 'doi':
      return { format, entries: parseDois(text).map((e) => () => e) };
    case 'bibtex':
      return { format, entries: bibtexEntries(text) };
    case 'ris':
      return { format, entries: risEntries(text) };
    case 'csl-json':
      return { format, entries: parseCslJson(text).map((e) => () => e) };
    default:
      return {
        format: null,
        entries: nothingFound('Could not tell the format: paste a DOI, BibTeX, RIS or CSL-JSON.'),
      };
  }
}

export function parseSource(text: string, format: SourceFormat | null = detectFormat(text)): ParsedSource {
  const split = splitSource(text, format);
  return { format: split.format, entries: split.entries.map((parse) => parse()) };
}

function parseDois(text: string): ParsedEntry[] {
  return text
    .trim()
    .split(/[\s,;]+/)
    .filter(Boolean)
    .map((word, index): ParsedEntry => {
      const doi = normalizeDoi(word);
      return doi
        ? { kind: 'doi', index, doi }
        : { kind: 'failed', index, title: word, reason: `"${word}" is not a DOI.` };
    });
}

// ---------------------------------------------------------------------------------------------
// RIS
// ---------------------------------------------------------------------------------------------

/** Splits after each end-of-record tag (ER), noting the line each record starts on. */
export function splitRis(text: string): { line: number; text: string }[] {
  const normalized = text.replace(/\r\n?/g, '\n');
  const records: { start: number; text: string }[] = [];
  const end = /^ER {1,2}-.*$/gm;
  let from = 0;
  for (let m = end.exec(normalized); ; m = end.exec(normalized)) {
    const chunk = normalized.slice(from, m ? m.index : normalized.length);
    const start = chunk.search(RIS_START);
    if (start !== -1) records.push({ start: from + start, text: `${chunk.slice(start).trim()}\nER  - \n` });
    if (!m) break;
    from = m.index + m[0].length;
  }
  const lines = linesAt(
    normalized,
    records.map((r) => r.start),
  );
  return records.map((r, i) => ({ line: lines[i], text: r.text }));
}

function risTitle(chunk: string): string | null {
  return chunk.match(/^(?:TI|T1) {1,2}- ?(.+)$/m)?.[1].trim() ?? null;
}

function risEntries(text: string): (() => ParsedEntry)[] {
  const records = splitRis(text);
  if (!records.length) return nothingFound('No RIS records found (a record starts with a TY line and ends with ER).');
  return records.map((record, index) => () => {
    const title = risTitle(record.text);
    const where = at('RIS record', record.line);
    try {
      const [item] = plugins.input.chain(record.text, { generateGraph: false, forceType: FORCED_TYPES.ris });
      return accept(index, item, title, where);
    } catch (error) {
      return failure(index, title, where, error);
    }
  });
}

export function parseRis(text: string): ParsedEntry[] {
  return risEntries(text).map((parse) => parse());
}

// ---------------------------------------------------------------------------------------------
// CSL-JSON
// ---------------------------------------------------------------------------------------------

export function parseCslJson(text: string): ParsedEntry[] {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    return [{ kind: 'failed', index: 0, title: null, reason: 'The text starts like CSL-JSON but is not valid JSON.' }];
  }
  const items = Array.isArray(data) ? data : [data];
  if (!items.length) return [{ kind: 'failed', index: 0, title: null, reason: 'The CSL-JSON list is empty.' }];
  return items.map((item, index) => {
    if (typeof item !== 'object' || item === null || Array.isArray(item)) {
      return { kind: 'failed', index, title: null, reason: 'A CSL-JSON entry must be an object.' };
    }
    const title = typeof (item as CslItem).title === 'string' ? ((item as CslItem).title as string) : null;
    const where = at('CSL-JSON entry', null);
    try {
      const [csl] = plugins.input.chain(item, { generateGraph: false, forceType: FORCED_TYPES.csl });
      return accept(index, csl, title, where);
    } catch (error) {
      return failure(index, title, where, error);
    }
  });
}

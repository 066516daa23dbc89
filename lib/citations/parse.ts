import { cleanCsl, cslTitle, type CslItem } from './csl';
import { normalizeDoi } from './doi';
import { FORCED_TYPES, plugins } from './engine';

/**
 * Turning pasted or uploaded library text into CSL-JSON items, one result per entry, so one
 * broken entry in a 2,000-entry file fails alone with a reason instead of failing the file.
 * Parsing is offline (citation-js); DOIs are only recognised here and looked up by the caller.
 */

export type SourceFormat = 'doi' | 'bibtex' | 'ris' | 'csl-json';

export type ParsedEntry =
  | { kind: 'parsed'; index: number; csl: CslItem }
  | { kind: 'doi'; index: number; doi: string }
  | { kind: 'failed'; index: number; title: string | null; reason: string };

export interface ParsedSource {
  format: SourceFormat | null;
  entries: ParsedEntry[];
}

const BIBTEX_ENTRY_START = /^[ \t]*@[A-Za-z]+[ \t]*[{(]/m;
const RIS_START = /^TY {1,2}- ?/m;

/**
 * What the text looks like: CSL-JSON (starts with [ or {), BibTeX (an @type{ line), RIS (a TY
 * tag line), or a list of DOIs (every word a DOI); null when none of these.
 */
export function detectFormat(text: string): SourceFormat | null {
  const trimmed = text.trim();
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

export function splitSource(text: string, format: SourceFormat | null = detectFormat(text)): SplitSource {
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
        entries: [
          () => ({
            kind: 'failed',
            index: 0,
            title: null,
            reason: 'Could not tell the format: paste a DOI, BibTeX, RIS or CSL-JSON.',
          }),
        ],
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

/** One item from citation-js, checked: it must have a title to be a study. */
function accept(index: number, items: CslItem[], fallbackTitle: string | null, what: string): ParsedEntry {
  if (!items.length || !items[0] || typeof items[0] !== 'object' || !Object.keys(items[0]).length) {
    return { kind: 'failed', index, title: fallbackTitle, reason: `Could not read this ${what}; check its syntax.` };
  }
  const csl = cleanCsl(items[0]);
  if (!cslTitle(csl)) return { kind: 'failed', index, title: fallbackTitle, reason: `This ${what} has no title.` };
  return { kind: 'parsed', index, csl };
}

function failure(index: number, title: string | null, what: string, error: unknown): ParsedEntry {
  // citation-js syntax errors quote the offending line; keep only the first line of it.
  const detail = error instanceof Error ? error.message.split('\n')[0].slice(0, 160) : 'unreadable';
  return { kind: 'failed', index, title, reason: `Could not read this ${what}: ${detail}.` };
}

// ---------------------------------------------------------------------------------------------
// BibTeX
// ---------------------------------------------------------------------------------------------

/**
 * Splits at each line that opens an entry (`@article{`, `@book(` …). @string macros are kept
 * and prefixed to every entry so abbreviations still expand; @comment and @preamble are skipped.
 */
export function splitBibtex(text: string): { macros: string; entries: string[] } {
  const starts: number[] = [];
  const pattern = /^[ \t]*@[A-Za-z]+[ \t]*[{(]/gm;
  for (let m = pattern.exec(text); m; m = pattern.exec(text)) starts.push(m.index);
  const macros: string[] = [];
  const entries: string[] = [];
  starts.forEach((start, i) => {
    const chunk = text.slice(start, starts[i + 1] ?? text.length).trim();
    const type = chunk.match(/^@([A-Za-z]+)/)?.[1].toLowerCase();
    if (type === 'string') macros.push(chunk);
    else if (type !== 'comment' && type !== 'preamble') entries.push(chunk);
  });
  return { macros: macros.join('\n'), entries };
}

/** The title field as typed, braces included (single-line titles only; null otherwise). */
function rawBibtexTitle(chunk: string): string | null {
  return chunk.match(/^\s*title\s*=\s*[{"](.+?)[}"]\s*,?\s*$/im)?.[1] ?? null;
}

/**
 * citation-js's sentence case lower-cases unprotected words but leaves both halves of a
 * hyphenated compound as typed ("Twelve-Week"); APA sentence case lower-cases them like any
 * other word, except the first word of the title or of a subtitle ("Cold-water immersion …
 * twelve-week gains"; American Psychological Association, 2020, Publication Manual, 7th ed.,
 * ch. 6, sentence case). Only compounds of plain capitalized words are touched (acronyms such
 * as "MVC-Based" keep their capitals), and none the raw BibTeX protected with braces.
 */
export function lowerHyphenatedParts(title: string, rawTitle: string | null): string {
  if (rawTitle === null) return title;
  const protectedText = [...rawTitle.matchAll(/\{([^{}]*)\}/g)].map((m) => m[1]).join(' ');
  return title.replace(
    /(?<![\p{L}-])(\p{L}\p{Ll}*)((?:-\p{L}\p{Ll}*)+)(?![\p{L}-])/gu,
    (whole: string, first: string, rest: string, offset: number) => {
      if (protectedText.includes(whole)) return whole;
      const startsSentence = offset === 0 || /[:.?!]\s*$/.test(title.slice(0, offset));
      return `${startsSentence ? first : first.toLowerCase()}${rest.toLowerCase()}`;
    },
  );
}

function bibtexTitle(chunk: string): string | null {
  const title = chunk.match(/^\s*title\s*=\s*[{"]\s*(.+?)\s*[}"]\s*,?\s*$/im)?.[1];
  if (title) return title.replace(/[{}]/g, '');
  return chunk.match(/^@[A-Za-z]+\s*[{(]\s*([^,\s]+)/)?.[1] ?? null;
}

function bibtexEntries(text: string): (() => ParsedEntry)[] {
  const { macros, entries } = splitBibtex(text);
  if (!entries.length)
    return [
      () => ({
        kind: 'failed',
        index: 0,
        title: null,
        reason: 'No BibTeX entries found (an entry starts with @article{ or similar).',
      }),
    ];
  return entries.map((chunk, index) => () => {
    const title = bibtexTitle(chunk);
    try {
      const items = plugins.input.chain(macros ? `${macros}\n${chunk}` : chunk, {
        generateGraph: false,
        forceType: FORCED_TYPES.bibtex,
      });
      const entry = accept(index, items, title, 'BibTeX entry');
      if (entry.kind === 'parsed')
        entry.csl.title = lowerHyphenatedParts(entry.csl.title as string, rawBibtexTitle(chunk));
      return entry;
    } catch (error) {
      return failure(index, title, 'BibTeX entry', error);
    }
  });
}

export function parseBibtex(text: string): ParsedEntry[] {
  return bibtexEntries(text).map((parse) => parse());
}

// ---------------------------------------------------------------------------------------------
// RIS
// ---------------------------------------------------------------------------------------------

/** Splits after each end-of-record tag (ER). */
export function splitRis(text: string): string[] {
  return text
    .replace(/\r\n?/g, '\n')
    .split(/^ER {1,2}-.*$/m)
    .map((chunk) => chunk.trim())
    .filter((chunk) => RIS_START.test(chunk))
    .map((chunk) => `${chunk.slice(chunk.search(RIS_START))}\nER  - \n`);
}

function risTitle(chunk: string): string | null {
  return chunk.match(/^(?:TI|T1) {1,2}- ?(.+)$/m)?.[1].trim() ?? null;
}

function risEntries(text: string): (() => ParsedEntry)[] {
  const records = splitRis(text);
  if (!records.length)
    return [
      () => ({
        kind: 'failed',
        index: 0,
        title: null,
        reason: 'No RIS records found (a record starts with a TY line and ends with ER).',
      }),
    ];
  return records.map((chunk, index) => () => {
    const title = risTitle(chunk);
    try {
      return accept(
        index,
        plugins.input.chain(chunk, { generateGraph: false, forceType: FORCED_TYPES.ris }),
        title,
        'RIS record',
      );
    } catch (error) {
      return failure(index, title, 'RIS record', error);
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
    try {
      return accept(
        index,
        plugins.input.chain(item, { generateGraph: false, forceType: FORCED_TYPES.csl }),
        title,
        'CSL-JSON entry',
      );
    } catch (error) {
      return failure(index, title, 'CSL-JSON entry', error);
    }
  });
}

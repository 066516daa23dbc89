import type { CslItem } from './csl';
import { FORCED_TYPES, plugins } from './engine';
import { accept, at, failure, linesAt, nothingFound, type ParsedEntry } from './entry';

/**
 * BibTeX and biblatex files as reference managers export them. citation-js does the reading:
 * LaTeX accents and commands (`{\"u}` → ü, `\&` → &, `--` → –), `@string` macros, `crossref`
 * inheritance (biblatex manual §2.4.1 and appendix B) and the biblatex entry types (`@online`,
 * `@report`, `@thesis`, `@collection` …). What it leaves to us:
 *
 * - a syntax error in one entry stops its whole-file parser, so a file that fails is read again
 *   entry by entry and only the broken entries fail, each naming its line;
 * - `xdata` (biblatex manual §3.13.6: an `@xdata` entry holds fields other entries inherit, and is
 *   not a work in itself) is merged here, before citation-js maps fields;
 * - `crossref` parents are handed to citation-js with each child, so a child parsed on its own
 *   still inherits.
 */

/** One `@type{…}` of the file with where it starts. */
interface Chunk {
  type: string;
  label: string | null;
  line: number;
  text: string;
}

/** An entry as citation-js's file grammar reads it, before its field values are decoded. */
interface RawEntry {
  type: string;
  label: string;
  properties: Record<string, unknown>;
}

const ENTRY_START = /^[ \t]*@[A-Za-z]+[ \t]*[{(]/gm;
const SKIPPED = new Set(['comment', 'preamble']);

/**
 * Splits at each line that opens an entry (`@article{`, `@book(` …), noting the line.
 * `@string` chunks are macros, `@comment` and `@preamble` are skipped.
 */
export function splitBibtex(text: string): { macros: Chunk[]; entries: Chunk[] } {
  const starts: number[] = [];
  for (let m = ENTRY_START.exec(text); m; m = ENTRY_START.exec(text)) starts.push(m.index + m[0].indexOf('@'));
  const lines = linesAt(text, starts);
  const macros: Chunk[] = [];
  const entries: Chunk[] = [];
  starts.forEach((start, i) => {
    const chunk = text.slice(start, starts[i + 1] ?? text.length).trim();
    const head = chunk.match(/^@([A-Za-z]+)\s*[{(]\s*([^,\s]*)/);
    const type = head?.[1].toLowerCase() ?? '';
    const piece = { type, label: head?.[2] || null, line: lines[i], text: chunk };
    if (type === 'string') macros.push(piece);
    else if (!SKIPPED.has(type)) entries.push(piece);
  });
  return { macros, entries };
}

/** The title field as typed, braces included (single-line titles only; null otherwise). */
function rawBibtexTitle(chunk: string): string | null {
  return chunk.match(/^\s*title\s*=\s*[{"](.+?)[}"]\s*,?\s*$/im)?.[1] ?? null;
}

/** A readable title for a failed entry: the title line without braces, else the key. */
function fallbackTitle(chunk: Chunk): string | null {
  const title = chunk.text.match(/^\s*title\s*=\s*[{"]\s*(.+?)\s*[}"]\s*,?\s*$/im)?.[1];
  return title ? title.replace(/[{}]/g, '') : chunk.label;
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
  if (rawTitle === null || !title.includes('-')) return title;
  let protectedText: string | undefined;
  return title.replace(
    /(?<![\p{L}-])(\p{L}\p{Ll}*)((?:-\p{L}\p{Ll}*)+)(?![\p{L}-])/gu,
    (whole: string, first: string, rest: string, offset: number) => {
      protectedText ??= [...rawTitle.matchAll(/\{([^{}]*)\}/g)].map((m) => m[1]).join(' ');
      if (protectedText.includes(whole)) return whole;
      const startsSentence = offset === 0 || /[:.?!]\s*$/.test(title.slice(0, offset));
      return `${startsSentence ? first : first.toLowerCase()}${rest.toLowerCase()}`;
    },
  );
}

const readRaw = (text: string): RawEntry[] =>
  plugins.input.chain(text, {
    generateGraph: false,
    forceType: FORCED_TYPES.bibtex,
    target: '@biblatex/entries+list',
  }) as unknown as RawEntry[];

/** "expected "comma", got "label" at line 2 col 3:" → the message with the line made absolute. */
function syntaxReason(error: unknown, chunk: Chunk, prefixLines: number): Error {
  const message = error instanceof Error ? error.message.split('\n')[0] : String(error);
  const where = message.match(/^(.*?) at line (\d+) col \d+:?$/);
  if (!where) return new Error(message);
  return new Error(`${where[1]} (line ${chunk.line + Number(where[2]) - 1 - prefixLines})`);
}

/** Chunks re-read together when the whole file would not parse: one bad entry costs its group a second read. */
const GROUP = 64;

const sameLabels = (entries: RawEntry[], chunks: Chunk[]) =>
  entries.length === chunks.length && entries.every((entry, i) => entry.label === chunks[i].label);

/**
 * The raw entries of every chunk: the whole file in one parse when it is well formed (the fast
 * path, a single pass of citation-js's grammar); else in groups with the macros in front, and
 * chunk by chunk only inside a group that fails, so the broken entries are known and the rest
 * still read at close to the speed of the fast path.
 */
function readChunks(text: string, macros: Chunk[], chunks: Chunk[]): (RawEntry | Error)[] {
  try {
    const whole = readRaw(text);
    if (sameLabels(whole, chunks)) return whole;
  } catch {
    // Some entry is malformed: fall through and find which.
  }
  const prefix = macros.map((m) => m.text).join('\n');
  const prefixLines = prefix ? prefix.split('\n').length : 0;
  const read = (body: string) => readRaw(prefix ? `${prefix}\n${body}` : body);
  const out: (RawEntry | Error)[] = [];
  for (let g = 0; g < chunks.length; g += GROUP) {
    const group = chunks.slice(g, g + GROUP);
    try {
      const entries = read(group.map((c) => c.text).join('\n'));
      if (sameLabels(entries, group)) {
        out.push(...entries);
        continue;
      }
    } catch {
      // Read this group's chunks one by one.
    }
    for (const chunk of group) {
      try {
        out.push(read(chunk.text)[0] ?? new Error('no entry found'));
      } catch (error) {
        out.push(syntaxReason(error, chunk, prefixLines));
      }
    }
  }
  return out;
}

const keysOf = (value: unknown) =>
  typeof value === 'string'
    ? value
        .split(',')
        .map((k) => k.trim())
        .filter(Boolean)
    : [];

/** The entry with the fields of its `xdata` sources it lacks (sources may themselves use xdata). */
function withXdata(entry: RawEntry, sources: Map<string, RawEntry>, seen = new Set<string>()): RawEntry {
  const keys = keysOf(entry.properties.xdata);
  if (!keys.length) return entry;
  const properties: Record<string, unknown> = { ...entry.properties };
  delete properties.xdata;
  for (const key of keys) {
    const source = sources.get(key);
    if (!source || seen.has(key)) continue;
    const inherited = withXdata(source, sources, new Set([...seen, key])).properties;
    for (const [field, value] of Object.entries(inherited)) if (!(field in properties)) properties[field] = value;
  }
  return { ...entry, properties };
}

/** The entry and the chain of its `crossref` parents, which citation-js resolves among the list it is given. */
function withParents(entry: RawEntry, byLabel: Map<string, RawEntry>): RawEntry[] {
  const list = [entry];
  for (let key = entry.properties.crossref; typeof key === 'string' && list.length < 5;) {
    const parent = byLabel.get(key);
    if (!parent || list.includes(parent)) break;
    list.push(parent);
    key = parent.properties.crossref;
  }
  return list;
}

/** The entries of a BibTeX text, each decoded only when its thunk is called (for progress in batches). */
export function bibtexEntries(text: string): (() => ParsedEntry)[] {
  const { macros, entries: all } = splitBibtex(text);
  if (!all.length) return nothingFound('No BibTeX entries found (an entry starts with @article{ or similar).');
  const raw = readChunks(text, macros, all);
  const xdata = new Map<string, RawEntry>();
  const byLabel = new Map<string, RawEntry>();
  for (const entry of raw) {
    if (entry instanceof Error) continue;
    if (entry.type.toLowerCase() === 'xdata') xdata.set(entry.label, entry);
    else byLabel.set(entry.label, entry);
  }
  const works = all.flatMap((chunk, i) => (chunk.type === 'xdata' ? [] : [{ chunk, entry: raw[i] }]));
  const complete = works.map(({ entry }) => (entry instanceof Error ? entry : withXdata(entry, xdata)));
  const parentsOf = (entry: RawEntry) =>
    withParents(entry, byLabel)
      .slice(1)
      .map((e) => withXdata(e, xdata));

  // Decoded a batch at a time (one citation-js call per batch, not per entry), when the batch's
  // first entry is asked for; an entry of a batch that fails is decoded on its own.
  const decoded = new Map<number, CslItem | Error>();
  const decodeBatch = (first: number) => {
    const members = complete
      .slice(first, first + DECODE_BATCH)
      .map((entry, i) => ({ index: first + i, entry }))
      .filter((m): m is { index: number; entry: RawEntry } => !(m.entry instanceof Error));
    const mine = new Set(members.map((m) => m.entry));
    const parents = [...new Set(members.flatMap((m) => parentsOf(m.entry)))].filter((p) => !mine.has(p));
    try {
      const items = decodeAll([...members.map((m) => m.entry), ...parents]);
      members.forEach((m, i) => decoded.set(m.index, items[i]));
    } catch {
      for (const m of members) decoded.set(m.index, decode(m.entry, parentsOf(m.entry)));
    }
  };

  return works.map(({ chunk }, index) => () => {
    const where = at('BibTeX entry', chunk.line);
    const entry = complete[index];
    if (entry instanceof Error) return failure(index, fallbackTitle(chunk), where, entry);
    if (!decoded.has(index)) decodeBatch(index);
    const item = decoded.get(index)!;
    decoded.delete(index);
    if (item instanceof Error) return failure(index, fallbackTitle(chunk), where, item);
    // The title typed in the file is read only when it is needed: for a failure, or a hyphen.
    const parsed = accept(index, item, null, where);
    if (parsed.kind === 'failed') return { ...parsed, title: fallbackTitle(chunk) };
    if (parsed.kind !== 'parsed') return parsed;
    const title = parsed.csl.title as string;
    if (title.includes('-')) parsed.csl.title = lowerHyphenatedParts(title, rawBibtexTitle(chunk.text));
    return parsed;
  });
}

/**
 * Fields the library reads (reference, dates, identifiers, what a design is suggested from). A
 * LaTeX slip in any other field — an annotation, a file path, a reference manager's group list —
 * must not cost the coach the study, so when the whole entry does not decode, it is decoded
 * again with these alone.
 */
const CORE_FIELDS = new Set([
  'title',
  'subtitle',
  'titleaddon',
  'shorttitle',
  'author',
  'editor',
  'translator',
  'journal',
  'journaltitle',
  'journalsubtitle',
  'shortjournal',
  'booktitle',
  'booksubtitle',
  'maintitle',
  'series',
  'year',
  'date',
  'month',
  'volume',
  'number',
  'issue',
  'pages',
  'eid',
  'edition',
  'doi',
  'url',
  'urldate',
  'eprint',
  'eprinttype',
  'isbn',
  'issn',
  'publisher',
  'institution',
  'school',
  'organization',
  'address',
  'location',
  'type',
  'howpublished',
  'keywords',
  'language',
  'crossref',
]);

/** Entries decoded together, in order; crossref parents among them resolve (citation-js's registry is the list). */
const decodeAll = (entries: RawEntry[]) =>
  plugins.input.chain(entries, { generateGraph: false, forceType: '@biblatex/entries+list' }) as CslItem[];
const decodeOnce = (family: RawEntry[]) => decodeAll(family)[0];
/** Entries per citation-js call when decoding. */
const DECODE_BATCH = 100;

/** The entry as CSL-JSON (its crossref parents beside it), or why it cannot be, naming the field at fault. */
function decode(entry: RawEntry, parents: RawEntry[]): CslItem | Error {
  try {
    return decodeOnce([entry, ...parents]);
  } catch {
    // Try again with the fields the library reads, below.
  }
  const core = Object.fromEntries(Object.entries(entry.properties).filter(([field]) => CORE_FIELDS.has(field)));
  try {
    return decodeOnce([{ ...entry, properties: core }, ...parents]);
  } catch (error) {
    const culprit = Object.keys(core).find((field) => {
      try {
        decodeOnce([{ ...entry, properties: { [field]: core[field] } }]);
        return false;
      } catch {
        return true;
      }
    });
    // The decoder's position is inside the field's value, not the file: keep only what it expected.
    const detail = (error instanceof Error ? error.message.split('\n')[0] : String(error)).replace(
      / at line \d+ col \d+:?$/,
      '',
    );
    return new Error(culprit ? `its ${culprit} field does not read as LaTeX (${detail})` : detail);
  }
}

export function parseBibtex(text: string): ParsedEntry[] {
  return bibtexEntries(text).map((parse) => parse());
}

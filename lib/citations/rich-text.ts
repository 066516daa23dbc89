import type { CslItem } from './csl';

/**
 * Plain text out of citation-js's rich text. Its BibTeX parser writes formatting as the HTML-like
 * tags CSL-JSON allows inside text fields (`<i>`, `<b>`, `<sup>`, `<sub>`, small caps and
 * `<span class="nocase">` for brace-protected words — CSL-JSON schema 1.0.2, "rich text" in the
 * CSL 1.0.2 specification, appendix "Rich text markup"). The library stores titles, journal names
 * and author names as plain Unicode — they are searched, sorted, compared for duplicates and shown
 * as text — so the tags go. The italic stretches of a title (a species name, "in vitro") are kept
 * as structured data in the item's `custom` field (CSL-JSON's place for data it has no field for),
 * as character ranges of the plain title.
 */

/** Exactly the tags citation-js emits (plugin-bibtex `constants.formatting`); any other `<` is text. */
const RICH_TAG = /<(\/?)(i|b|sup|sub|span)(?:\s[^<>]*)?>/g;

/** A [start, end) range of characters of the plain title that the source set in italics. */
export type TextRange = [number, number];

export interface PlainText {
  text: string;
  italics: TextRange[];
}

/**
 * The text without tags, and where its italic stretches were.
 *
 * @example
 * plainText('<i>Pseudomonas</i> in <span class="nocase">DNA</span>');
 * // { text: 'Pseudomonas in DNA', italics: [[0, 11]] }
 */
export function plainText(rich: string): PlainText {
  if (!rich.includes('<')) return { text: rich, italics: [] };
  let text = '';
  let last = 0;
  const italics: TextRange[] = [];
  const open: number[] = [];
  for (const match of rich.matchAll(RICH_TAG)) {
    text += rich.slice(last, match.index);
    last = match.index + match[0].length;
    if (match[2] !== 'i') continue;
    if (!match[1]) open.push(text.length);
    else {
      const start = open.pop();
      if (start !== undefined && text.length > start) italics.push([start, text.length]);
    }
  }
  text += rich.slice(last);
  return { text, italics: italics.sort((a, b) => a[0] - b[0]) };
}

/** Text fields of a CSL item that citation-js may fill with rich text. */
const TEXT_FIELDS = [
  'title',
  'title-short',
  'container-title',
  'container-title-short',
  'collection-title',
  'publisher',
  'publisher-place',
  'event-title',
  'genre',
  'medium',
  'note',
  'abstract',
  'keyword',
] as const;
const NAME_FIELDS = ['author', 'editor', 'translator', 'container-author', 'collection-editor', 'director'] as const;
const NAME_PARTS = ['family', 'given', 'literal', 'suffix', 'dropping-particle', 'non-dropping-particle'] as const;

/**
 * The whitespace that folding changes: a run of two or more, or one character that is not a plain
 * space. A lone space is already folded, and matching each one (as `/\s+/g` does, once a word)
 * would make a replace of an abstract cost a match and a piece of new string per word.
 */
const UNFOLDED = /\s{2,}|[^\S ]/g;

/** Whitespace runs (including the no-break space TeX's `~` becomes) folded to one space each. */
export const foldSpaces = (value: string) => value.replace(UNFOLDED, ' ');

/** Folded and trimmed. */
const tidy = (value: string) => foldSpaces(value).trim();

/**
 * Below U+0300 no character has a combining mark or a decomposition that NFC would change (the
 * combining marks start at U+0300, the singletons NFC replaces — Ω, Å, ; … — lie above it:
 * UAX #15 and the Unicode Character Database's DerivedNormalizationProps), so text made of such
 * characters only is already composed. Most names and titles are; skipping them spares ICU a
 * call per field.
 */
const MAY_NEED_COMPOSING = /[^\u0000-\u02ff]/;

/**
 * Accents composed: `{\"\i}` decodes to a dotless ı plus a combining diaeresis, which is an ï once
 * the dotless letter is undone (Unicode normalization form C, UAX #15).
 */
const compose = (value: string) =>
  MAY_NEED_COMPOSING.test(value)
    ? value
        .replace(/ı(?=[\u0300-\u036f])/g, 'i')
        .replace(/ȷ(?=[\u0300-\u036f])/g, 'j')
        .normalize('NFC')
    : value;

/**
 * The item with every text field and name part as plain text (whitespace folded too), and the
 * title's italics, if any, in `custom.titleItalics`. Other fields pass through untouched.
 */
export function plainCsl(item: CslItem): CslItem {
  const out: CslItem = { ...item };
  for (const field of TEXT_FIELDS) {
    if (typeof out[field] !== 'string') continue;
    const value = compose(out[field]);
    const plain = plainText(value);
    if (field === 'title' && plain.italics.length) {
      // Ranges are measured on the text as stored, so fold the whitespace first and shift by the trim.
      const folded = plainText(foldSpaces(value));
      const text = folded.text.trim();
      const lead = folded.text.length - folded.text.trimStart().length;
      const clamp = (n: number) => Math.min(text.length, Math.max(0, n - lead));
      out.custom = {
        ...(out.custom as object | undefined),
        titleItalics: folded.italics.map(([a, b]): TextRange => [clamp(a), clamp(b)]).filter(([a, b]) => b > a),
      };
      out[field] = text;
    } else out[field] = tidy(plain.text);
  }
  for (const field of NAME_FIELDS) {
    const names = out[field];
    if (!Array.isArray(names)) continue;
    out[field] = names.map((name) => {
      if (typeof name !== 'object' || name === null) return name;
      const copy: Record<string, unknown> = { ...name };
      for (const part of NAME_PARTS)
        if (typeof copy[part] === 'string') copy[part] = tidy(plainText(compose(copy[part])).text);
      return copy;
    });
  }
  return out;
}

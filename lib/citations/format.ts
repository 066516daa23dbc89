import { Cite } from './engine';
import { citationKey, type CslItem } from './csl';

/**
 * One study's reference in the four forms the library offers: APA 7th edition (through
 * citation-js's plugin-csl and its bundled 'apa' template, offline), BibTeX, RIS and CSL-JSON.
 */

export const REFERENCE_FORMATS = {
  apa: { mediaType: 'text/plain; charset=utf-8', extension: 'txt' },
  bibtex: { mediaType: 'application/x-bibtex; charset=utf-8', extension: 'bib' },
  ris: { mediaType: 'application/x-research-info-systems; charset=utf-8', extension: 'ris' },
  csl: { mediaType: 'application/vnd.citationstyles.csl+json; charset=utf-8', extension: 'json' },
} as const;
export type ReferenceFormat = keyof typeof REFERENCE_FORMATS;

export interface FormattedReference {
  format: ReferenceFormat;
  mediaType: string;
  filename: string;
  text: string;
  /** APA only: the same reference as HTML, with the journal and volume in italics as APA sets them. */
  html?: string;
}

/** citation-js needs an id on every item for BibTeX labels and the CSL engine. */
function withId(csl: CslItem): CslItem {
  const key =
    typeof csl['citation-key'] === 'string'
      ? csl['citation-key']
      : typeof csl.id === 'string'
        ? csl.id
        : citationKey(csl);
  return { ...csl, id: key, 'citation-key': key };
}

export function formatReference(csl: CslItem, format: ReferenceFormat): FormattedReference {
  const item = withId(csl);
  const { mediaType, extension } = REFERENCE_FORMATS[format];
  const filename = `${String(item.id).replace(/[^A-Za-z0-9._-]+/g, '-') || 'reference'}.${extension}`;
  if (format === 'csl') {
    const { id: _id, ...rest } = item;
    return { format, mediaType, filename, text: `${JSON.stringify([{ id: _id, ...rest }], null, 2)}\n` };
  }
  const cite = new Cite([item]);
  if (format === 'apa') {
    const options = { template: 'apa', lang: 'en-US' };
    const text = cite.format('bibliography', { ...options, format: 'text' }).trim();
    const html = cite.format('bibliography', { ...options, format: 'html' }).trim();
    return { format, mediaType, filename, text, html };
  }
  const text = cite.format(format).trim();
  return { format, mediaType, filename, text: `${format === 'ris' ? unwrapRis(text) : text}\n` };
}

/**
 * citation-js's RIS writer breaks every value after 70 characters, even mid-word ("A r\nandomized"),
 * and RIS readers (citation-js's own included) join a continuation line with a space, so a
 * long title would not survive a round trip. We write each tag's value on one line instead,
 * which citation-js's reader takes whole (checked by tests/unit/citations: export, re-import).
 */
export function unwrapRis(text: string): string {
  const lines: string[] = [];
  for (const line of text.split('\n')) {
    if (/^[A-Z][A-Z0-9] {2}-/.test(line) || lines.length === 0) lines.push(line);
    else lines[lines.length - 1] += line;
  }
  return lines.join('\n');
}

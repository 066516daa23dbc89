import { cleanCsl, cslTitle, type CslItem } from './csl';
import { plainCsl } from './rich-text';

/**
 * One entry of an imported text, parsed or not. Every entry gets its own result so one broken
 * entry in a 5,000-entry file fails alone, with a reason that names where it is.
 */
export type ParsedEntry =
  | { kind: 'parsed'; index: number; csl: CslItem }
  | { kind: 'doi'; index: number; doi: string }
  | { kind: 'failed'; index: number; title: string | null; reason: string };

/** Where an entry starts in the source, for messages ("the BibTeX entry at line 48"). */
export const at = (what: string, line: number | null) =>
  line === null ? `this ${what}` : `the ${what} at line ${line}`;

/** A text with no entry at all: one failed result saying what an entry looks like. */
export const nothingFound = (reason: string): (() => ParsedEntry)[] => [
  () => ({ kind: 'failed', index: 0, title: null, reason }),
];

const capital = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/**
 * One item from citation-js, checked and made fit to store: it must have a title to be a study;
 * its text fields become plain Unicode (./rich-text.ts) and its bookkeeping goes (./csl.ts).
 */
export function accept(
  index: number,
  item: CslItem | undefined,
  fallbackTitle: string | null,
  where: string,
): ParsedEntry {
  if (!item || typeof item !== 'object' || !Object.keys(item).length) {
    return { kind: 'failed', index, title: fallbackTitle, reason: `Could not read ${where}; check its syntax.` };
  }
  const csl = plainCsl(cleanCsl(item));
  if (!cslTitle(csl)) return { kind: 'failed', index, title: fallbackTitle, reason: `${capital(where)} has no title.` };
  return { kind: 'parsed', index, csl };
}

/** A parser error as a reason: only its first line (citation-js errors go on to quote the source). */
export function failure(index: number, title: string | null, where: string, error: unknown): ParsedEntry {
  const detail = error instanceof Error ? error.message.split('\n')[0].slice(0, 160) : 'unreadable';
  return { kind: 'failed', index, title, reason: `Could not read ${where}: ${detail}.` };
}

/**
 * The 1-based line of each offset, offsets ascending, counted in one pass over the text (a
 * per-entry count from the start would be quadratic on a 5,000-entry file).
 */
export function linesAt(text: string, offsets: number[]): number[] {
  const lines: number[] = [];
  let line = 1;
  let from = 0;
  for (const offset of offsets) {
    for (let i = text.indexOf('\n', from); i !== -1 && i < offset; i = text.indexOf('\n', i + 1)) {
      line += 1;
      from = i + 1;
    }
    lines.push(line);
  }
  return lines;
}

import { cslNames, cslTitle, cslYear, type CslItem, type CslName } from './csl';

/**
 * The author–year form of an inline citation, the APA 7th edition pattern for parenthetical
 * citations (American Psychological Association, 2020, Publication Manual, 7th ed., ch. 8):
 * one author "Holt, 2024"; two authors "Holt & Wren, 2024"; three or more "Holt et al., 2024";
 * a group author by its name; no date "n.d."; no author: the title's first words.
 * Computed here rather than through the CSL engine: the library lists thousands of studies and
 * the engine takes milliseconds per item.
 *
 * @example
 * authorYear({ author: [{ family: 'Holt' }, { family: 'Wren' }], issued: { 'date-parts': [[2024]] } }); // 'Holt & Wren, 2024'
 */
export function authorYear(csl: CslItem): string {
  const year = cslYear(csl);
  const date = year === null ? 'n.d.' : String(year);
  let names = cslNames(csl, 'author');
  if (!names.length) names = cslNames(csl, 'editor');
  return `${whoPart(names, csl)}, ${date}`;
}

const nameOf = (n: CslName): string => (n.literal ?? n.family ?? '').trim();

function whoPart(names: CslName[], csl: CslItem): string {
  if (names.length === 1) return nameOf(names[0]);
  if (names.length === 2) return `${nameOf(names[0])} & ${nameOf(names[1])}`;
  if (names.length > 2) return `${nameOf(names[0])} et al.`;
  // APA: with no author, the title takes the author's place (shortened here to a few words).
  const title = cslTitle(csl) ?? 'Untitled';
  const words = title.split(/\s+/);
  return words.length > 4 ? `${words.slice(0, 4).join(' ')}…` : title;
}

import { authorYear } from '@/lib/citations/author-year';
import { cslJournal, cslTitle, cslYear, fingerprint, type CslItem } from '@/lib/citations/csl';
import { normalizeDoi } from '@/lib/citations/doi';

/**
 * The columns copied out of a study's CSL-JSON (for sorting, searching and the duplicate
 * check), recomputed whenever the reference changes so they never disagree with it.
 */
export function referenceColumns(csl: CslItem) {
  const title = (cslTitle(csl) ?? 'Untitled').slice(0, 1000);
  const year = cslYear(csl);
  const doi = typeof csl.DOI === 'string' ? normalizeDoi(csl.DOI) : null;
  const journal = cslJournal(csl);
  return {
    title,
    year,
    doi,
    journal: journal ? journal.slice(0, 500) : null,
    citation: authorYear(csl).slice(0, 300),
    fingerprint: fingerprint(title, year),
  };
}

import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { authorYear } from '@/lib/citations/author-year';
import { cslJournal, cslYear } from '@/lib/citations/csl';
import { formatReference } from '@/lib/citations/format';
import { detectFormat, formatFromFilename, parseSource, type ParsedEntry } from '@/lib/citations/parse';

const fixture = (name: string) => readFileSync(path.resolve(__dirname, '../../../fixtures/citations', name), 'utf8');
const parsed = (entries: ParsedEntry[]) =>
  entries.filter((e): e is Extract<ParsedEntry, { kind: 'parsed' }> => e.kind === 'parsed');
const failed = (entries: ParsedEntry[]) =>
  entries.filter((e): e is Extract<ParsedEntry, { kind: 'failed' }> => e.kind === 'failed');

describe('format detection', () => {
  it('tells BibTeX, RIS, CSL-JSON and DOI lists apart, and by file name', () => {
    expect(detectFormat(fixture('library.bib'))).toBe('bibtex');
    expect(detectFormat(fixture('library.ris'))).toBe('ris');
    expect(detectFormat(fixture('library.json'))).toBe('csl-json');
    expect(detectFormat('10.5555/hjts.2024.0312\nhttps://doi.org/10.5555/ABC')).toBe('doi');
    expect(detectFormat('light daily hangs make fingers stronger')).toBeNull();
    expect(detectFormat('https://example.test/some-page')).toBeNull();
    expect(formatFromFilename('My Library.BIB')).toBe('bibtex');
    expect(formatFromFilename('x.ris')).toBe('ris');
    expect(formatFromFilename('x.json')).toBe('csl-json');
    expect(formatFromFilename('x.pdf')).toBeNull();
  });
});

describe('BibTeX fixture import', () => {
  const { format, entries } = parseSource(fixture('library.bib'));

  it('reads the four valid entries and names the two broken ones with a reason', () => {
    expect(format).toBe('bibtex');
    expect(entries.map((e) => e.index)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(parsed(entries).map((e) => e.index)).toEqual([0, 1, 2, 3]);
    const bad = failed(entries);
    expect(bad.map((e) => e.index)).toEqual([4, 5]);
    expect(bad[0].title).toBe('This Entry Has No Comma after Its Key');
    // The reason names the line the entry starts on and the line of the fault.
    expect(bad[0].reason).toBe('Could not read the BibTeX entry at line 48: expected "comma", got "label" (line 49).');
    expect(bad[1].reason).toBe('The BibTeX entry at line 54 has no title.');
  });

  it('maps fields to CSL-JSON: names, @string macro, accents, pages, lower-cased DOI, sentence-case title', () => {
    const [holt, okafor, castellan, vale] = parsed(entries).map((e) => e.csl);
    expect(holt.author).toEqual([
      { family: 'Holt', given: 'Maren A.' },
      { family: 'Wren', given: 'Tobias' },
    ]);
    expect(cslJournal(holt)).toBe('Hollowridge Journal of Training Science');
    expect(holt.title).toBe('Daily light pinch lifts and thumb tendon stiffness in MVC testing: A randomized trial');
    expect(holt.DOI).toBe('10.5555/hjts.2024.0312');
    expect(holt.page).toBe('101-115');
    expect(cslYear(holt)).toBe(2024);
    expect(okafor.author).toHaveLength(4);
    expect((castellan.author as { family: string }[])[1].family).toBe('Müller-Sand');
    expect(vale.type).toBe('book');
    expect(vale.DOI).toBeUndefined();
    expect(Object.keys(holt).some((k) => k.startsWith('_'))).toBe(false);
  });

  it('gives the APA author–year form for one, two and four authors', () => {
    const [holt, okafor, , vale] = parsed(entries).map((e) => e.csl);
    expect(authorYear(holt)).toBe('Holt & Wren, 2024');
    expect(authorYear(okafor)).toBe('Okafor et al., 2023');
    expect(authorYear(vale)).toBe('Vale, 2021');
    expect(
      authorYear({ title: 'A consensus statement on grip', author: [{ literal: 'Hollowridge Coaching Panel' }] }),
    ).toBe('Hollowridge Coaching Panel, n.d.');
  });
});

describe('RIS and CSL-JSON fixture import', () => {
  it('reads the RIS records and names the one without a title', () => {
    const { format, entries } = parseSource(fixture('library.ris'));
    expect(format).toBe('ris');
    expect(parsed(entries).map((e) => e.csl.title)).toEqual([
      'Tendon stiffness after six weeks of isometric finger training',
      'Perceived effort and lock-off holds in recreational boulderers',
    ]);
    const first = parsed(entries)[0].csl;
    expect(first.author).toEqual([
      { family: 'Holt', given: 'Maren A.' },
      { family: 'Castellan', given: 'Priya' },
    ]);
    expect(first.page).toBe('45-58');
    expect(first.DOI).toBe('10.5555/hjts.2025.0245');
    expect(cslYear(first)).toBe(2025);
    expect(failed(entries)).toEqual([
      { kind: 'failed', index: 2, title: null, reason: 'The RIS record at line 25 has no title.' },
    ]);
  });

  it('reads CSL-JSON items and refuses one without a title', () => {
    const { entries } = parseSource(fixture('library.json'));
    expect(parsed(entries)).toHaveLength(1);
    expect(failed(entries)[0]).toMatchObject({ index: 1, reason: 'This CSL-JSON entry has no title.' });
  });

  it('reports invalid JSON and unknown text as one failed entry, not an exception', () => {
    expect(parseSource('[{"title": ').entries).toEqual([
      { kind: 'failed', index: 0, title: null, reason: 'The text starts like CSL-JSON but is not valid JSON.' },
    ]);
    expect(parseSource('just some words').entries[0]).toMatchObject({
      kind: 'failed',
      reason: expect.stringMatching(/Could not tell the format/),
    });
  });

  it('turns a list of DOIs into lookups, one per DOI', () => {
    expect(parseSource('doi:10.5555/A.1, https://doi.org/10.5555/b.2').entries).toEqual([
      { kind: 'doi', index: 0, doi: '10.5555/a.1' },
      { kind: 'doi', index: 1, doi: '10.5555/b.2' },
    ]);
  });
});

/**
 * APA 7th edition journal-article reference pattern (American Psychological Association, 2020,
 * Publication Manual of the American Psychological Association, 7th ed., ch. 9 "Reference list"
 * and ch. 10 "Reference examples", journal article):
 *   Author, A. A., & Author, B. B. (Year). Title of article in sentence case. Journal Name in
 *   Title Case, volume(issue), pages with an en dash. https://doi.org/xx.xxxx/yyyy
 * with the journal name and volume in italics; up to 20 authors listed, "&" before the last.
 */
describe('APA 7th edition formatting', () => {
  const csl = parsed(parseSource(fixture('library.bib')).entries).map((e) => e.csl);

  it('formats a two-author article: initials, (year), sentence-case title, journal, volume(issue), en-dash pages, DOI link', () => {
    const apa = formatReference(csl[0], 'apa');
    expect(apa.text).toBe(
      'Holt, M. A., & Wren, T. (2024). Daily light pinch lifts and thumb tendon stiffness in MVC testing: A randomized trial. ' +
        'Hollowridge Journal of Training Science, 12(3), 101–115. https://doi.org/10.5555/hjts.2024.0312',
    );
    // Italics: the journal name and the volume, not the issue.
    expect(apa.html).toContain('<i>Hollowridge Journal of Training Science</i>, <i>12</i>(3), 101–115.');
  });

  it('lists every author of a four-author article with "&" before the last', () => {
    expect(formatReference(csl[1], 'apa').text).toBe(
      'Okafor, I., Brennick, T., Ferreira-Quist, A., & Lund, E. (2023). Cold-water immersion after strength sessions and twelve-week strength gains. ' +
        'Hollowridge Journal of Training Science, 11(1), 12–27. https://doi.org/10.5555/hjts.2023.0101',
    );
  });

  it('title-cases a journal name stored in lower case, as APA wants for periodical names', () => {
    const text = formatReference(
      { ...csl[2], 'container-title': 'hollowridge journal of training science' },
      'apa',
    ).text;
    expect(text).toContain('Hollowridge Journal of Training Science, 10(4), 220–231.');
  });

  it('formats a book: author, (year), title, publisher, and no DOI link when there is none', () => {
    const text = formatReference(csl[3], 'apa').text;
    expect(text).toBe('Vale, J. (2021). Grip training for climbers: A field guide. Hollowridge Press.');
    expect(text).not.toContain('doi.org');
  });

  it('exports BibTeX, RIS and CSL-JSON that read back to the same reference', () => {
    const bib = formatReference(csl[0], 'bibtex');
    expect(bib.filename).toMatch(/\.bib$/);
    expect(bib.text).toMatch(/^@article\{holt2024daily,/);
    const ris = formatReference(csl[0], 'ris');
    expect(ris.text).toMatch(/^TY {2}- JOUR/m);
    const json = formatReference(csl[0], 'csl');
    for (const [text] of [[bib.text], [ris.text], [json.text]]) {
      const again = parsed(parseSource(text).entries)[0].csl;
      expect(again.title).toBe(csl[0].title);
      expect(again.DOI).toBe('10.5555/hjts.2024.0312');
      expect(cslYear(again)).toBe(2024);
      expect((again.author as { family: string }[]).map((a) => a.family)).toEqual(['Holt', 'Wren']);
    }
  });
});

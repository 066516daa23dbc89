import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { authorYear } from '@/lib/citations/author-year';
import { cslJournal, cslYear, type CslItem } from '@/lib/citations/csl';
import { suggestDesign } from '@/lib/citations/design';
import { parseSource, type ParsedEntry } from '@/lib/citations/parse';
import { foldSpaces, plainCsl, plainText } from '@/lib/citations/rich-text';

/**
 * Real-world-shaped reference files (fixtures/citations/real-world.bib and .ris, invented entries
 * written the way reference managers and hand-kept .bib files write them). Each test names the
 * construct it checks. LaTeX meanings: the LaTeX2e reference manual (latexref.xyz); biblatex
 * types, crossref and xdata: the biblatex manual (§2.1 entry types, §2.4.1 and appendix B
 * crossref, §3.13.6 xdata); BibTeX case protection: Patashnik, "BibTeXing" (1988), §4.
 */

const fixture = (name: string) => readFileSync(path.resolve(__dirname, '../../../fixtures/citations', name), 'utf8');
const bib = parseSource(fixture('real-world.bib'));
const byIndex = (entries: ParsedEntry[], index: number): CslItem => {
  const entry = entries[index];
  if (entry.kind !== 'parsed') throw new Error(`entry ${index} did not parse: ${JSON.stringify(entry)}`);
  return entry.csl;
};
const entry = (index: number) => byIndex(bib.entries, index);
const allText = (csl: CslItem) => JSON.stringify(csl);

describe('real-world BibTeX: what reaches the library is plain Unicode', () => {
  it('skips @preamble and @comment, expands @string macros and # concatenation, and keeps @xdata out of the works', () => {
    expect(bib.format).toBe('bibtex');
    // 16 entries besides the preamble, comment, two macros and the xdata container.
    expect(bib.entries).toHaveLength(16);
    expect(cslJournal(entry(0))).toBe('Hollowridge Journal of Training Science');
    expect(cslJournal(entry(3))).toBe('Granite Hollow Proceedings');
  });

  it('decodes accents in titles and names: {\\"u} ü, \\c{c} ç, {\\O} Ø, {\\\'\\i} í, {\\"\\i} ï, \\v{c} č, {\\ss} ß', () => {
    const csl = entry(0);
    expect(csl.author).toEqual([
      { family: 'Müller', given: 'Jörg' },
      { family: 'François', given: 'Anaïs' },
      { family: 'Østby', given: 'Sigríd' },
      { family: 'Kovač', given: 'Neža' },
    ]);
    // Composed characters (NFC), not a letter plus a combining mark.
    expect((csl.author as { given: string }[])[1].given).toBe('Ana\u00efs');
    expect(csl.title).toBe("Große griffkraft – grip strength in Österreich's youth climbers");
    expect(authorYear(csl)).toBe('Müller et al., 2021');
  });

  it("decodes commands: \\TeX, \\LaTeX{}, \\& in a journal name, -- en dash, --- em dash, ``…'' quotes", () => {
    const csl = entry(1);
    expect(csl.title).toBe('The TeX of training logs and the LaTeX athlete: Typesetting “Load” — a narrative');
    expect(cslJournal(csl)).toBe('Training & Recovery');
    // biblatex `journaltitle` and `date`, and a DOI given as a link.
    expect(cslYear(csl)).toBe(2022);
    expect(csl.DOI).toBe('10.5555/tr.2022.17');
    // A corporate author in braces stays one name.
    expect(csl.author).toContainEqual({ family: 'Hollowridge Coaching Panel' });
  });

  it('removes case-protecting braces, keeping the words they protect as typed ({MVC}, {{Hollowridge}})', () => {
    expect(entry(2).title).toBe(
      'MVC-Guided hangboard loading for Hollowridge boulderers: A randomized controlled trial',
    );
  });

  it('stores no HTML: italics (\\emph, \\textit) leave the title as plain text and are kept as ranges in custom.titleItalics', () => {
    const csl = entry(3);
    expect(csl.title).toBe('Tenocyte response to cyclic load in vitro and ex vivo');
    const italics = (csl.custom as { titleItalics: [number, number][] }).titleItalics;
    expect(italics.map(([a, b]) => (csl.title as string).slice(a, b))).toEqual(['in vitro', 'ex vivo']);
    for (const csl of bib.entries.flatMap((e) => (e.kind === 'parsed' ? [e.csl] : []))) {
      expect(allText(csl)).not.toMatch(/<\/?(?:i|b|sup|sub|span)\b|nocase|\\[A-Za-z]/);
    }
  });

  it('decodes math: $\\dot{V}$ V̇, $_2$ ₂, $\\alpha$ α', () => {
    expect(entry(4).title).toBe('Peak V̇O₂ and α-actinin in trained climbers');
  });

  it('reads an entry in parentheses with quoted values, a "von" particle and a "Jr." suffix', () => {
    const csl = entry(5);
    expect(csl.title).toBe('Finger pulley injuries: A systematic review and meta-analysis');
    expect(csl.author).toEqual([
      { family: 'Brennick', given: 'Tomasz' },
      { family: 'Sand', given: 'Edda', 'non-dropping-particle': 'von' },
      { family: 'Quist', given: 'Pal', suffix: 'Jr.' },
    ]);
  });

  it('inherits through crossref: the paper takes the proceedings title as its container, year and publisher', () => {
    const paper = entry(7);
    expect(paper.type).toBe('paper-conference');
    expect(cslJournal(paper)).toBe('Proceedings of the Granite Hollow symposium on climbing science');
    expect(cslYear(paper)).toBe(2024);
    expect(paper.publisher).toBe('Granite Hollow Press');
    // The parent is a work of its own too.
    expect(entry(6).type).toBe('book');
  });

  it('inherits through xdata: journal, year and volume from the @xdata entry', () => {
    const csl = entry(8);
    expect(cslJournal(csl)).toBe('Hollowridge Journal of Training Science');
    expect(cslYear(csl)).toBe(2025);
    expect(csl.volume).toBe('13');
  });

  it('maps biblatex types: @online, @report, @thesis, @collection, @incollection, @misc', () => {
    expect([9, 10, 11, 12, 13, 15].map((i) => entry(i).type)).toEqual([
      'webpage',
      'report',
      'thesis',
      'book',
      'chapter',
      'document',
    ]);
    expect(entry(9).URL).toBe('https://granite-hollow.example/notes');
    expect(entry(12).editor).toEqual([{ family: 'Vale', given: 'Jonah' }]);
  });

  it('fails a malformed entry alone, naming the line it starts on and the line of the fault', () => {
    const broken = bib.entries[14];
    expect(broken).toEqual({
      kind: 'failed',
      index: 14,
      title: 'unclosed2014',
      reason: 'Could not read the BibTeX entry at line 129: expected "rbrace", got EOF (line 133).',
    });
    // The entry after it still reads.
    expect(entry(15).title).toBe('Twelve weeks of density hangs');
  });
});

describe('real-world RIS: byte-order mark, CRLF line ends, keywords', () => {
  const ris = parseSource(fixture('real-world.ris'));

  it('reads past a byte-order mark and Windows line ends, and names the record without a title by its line', () => {
    expect(ris.format).toBe('ris');
    expect(byIndex(ris.entries, 0).title).toBe(
      'Isometric Finger Training in Masters Climbers: A Randomized Crossover Trial',
    );
    expect(cslYear(byIndex(ris.entries, 0))).toBe(2024);
    expect(byIndex(ris.entries, 1).author).toEqual([{ literal: 'Granite Hollow Training Lab' }]);
    expect(ris.entries[2]).toEqual({
      kind: 'failed',
      index: 2,
      title: null,
      reason: 'The RIS record at line 22 has no title.',
    });
  });
});

describe('suggested design from the title and keywords', () => {
  it('reads the design the fixtures name, and suggests nothing where they name none', () => {
    const suggestions = bib.entries.map((e) => (e.kind === 'parsed' ? suggestDesign(e.csl) : 'failed'));
    expect(suggestions).toEqual([
      'cohort', // keywords "grip, youth, cohort"
      null, // "a narrative": no design named
      'randomized', // "A Randomized Controlled Trial"
      'in-vitro', // "in vitro"
      null,
      'meta-analysis', // "A Systematic Review and Meta-Analysis"
      null, // the proceedings volume
      'cohort', // "A Prospective Cohort Study"
      null,
      null,
      'cross-sectional', // "A Cross-Sectional Survey"
      null,
      null,
      'case-report', // "A Case Report"
      'failed',
      'randomized', // keywords "Randomized Controlled Trial; hangboard"
    ]);
    const ris = parseSource(fixture('real-world.ris')).entries;
    expect(suggestDesign(byIndex(ris, 0))).toBe('randomized'); // "Randomized Crossover Trial"
    expect(suggestDesign(byIndex(ris, 1))).toBe('cross-sectional'); // RIS keyword
  });

  it('settles titles that name two designs by the first rule: reviews of trials, animal trials, non-randomized trials, nested case-control', () => {
    const design = (title: string) => suggestDesign({ title });
    expect(design('Hangboard training: a systematic review of randomised controlled trials')).toBe('meta-analysis');
    expect(design('A randomized trial of tendon loading in rats')).toBe('animal');
    expect(design('A non-randomized controlled trial of campus boarding')).toBe('non-randomized');
    expect(design('Finger injuries in a climbing cohort: a nested case-control study')).toBe('case-control');
    expect(design('Pulley rupture in a boulderer: case series of five climbers')).toBe('case-series');
    expect(design('Hangboarding for youth climbers: a consensus statement')).toBe('expert-opinion');
    expect(design('Finger strength and climbing grade')).toBeNull();
    // Words that only look like a design are not one.
    expect(design('Randomness in route setting')).toBeNull();
  });
});

describe('plain text out of citation-js rich text', () => {
  // foldSpaces leaves a lone space alone (it is already folded) and replaces every other run.
  it('folds every whitespace run to one space, as one replace of /\\s+/ would', () => {
    const samples = [
      'plain words, one space each',
      '  lead and trail  ',
      'tab\there, new\nline, both \t\n here',
      'no\u00a0break, thin\u2009space, ideographic\u3000one',
      ' x\r\n\r\ny \u00a0 z\f\v',
      '\n',
      ' ',
      '',
    ];
    for (const text of samples) expect(foldSpaces(text)).toBe(text.replace(/\s+/g, ' '));
    expect(plainCsl({ title: 'T', abstract: '  Grip\n  strength\u00a0rose \t by 8 %.\n' }).abstract).toBe(
      'Grip strength rose by 8 %.',
    );
  });

  it('drops only the tags citation-js writes, and keeps a literal "<" in the text', () => {
    expect(plainText('<span class="nocase">DNA</span> and <b>bold</b> p <0.05')).toEqual({
      text: 'DNA and bold p <0.05',
      italics: [],
    });
    expect(plainText('<i>A</i> b <i>c <sup>2</sup></i>')).toEqual({
      text: 'A b c 2',
      italics: [
        [0, 1],
        [4, 7],
      ],
    });
  });

  it('cleans DOI-service records too: tags out of titles and names, whitespace folded', () => {
    expect(
      plainCsl({
        title: '  Effects of <i>Rhodiola</i>\n on grip ',
        'container-title': 'J <b>Train</b>',
        author: [{ family: '<span class="nocase">van</span> Berg', given: 'A.' }],
      }),
    ).toEqual({
      title: 'Effects of Rhodiola on grip',
      'container-title': 'J Train',
      author: [{ family: 'van Berg', given: 'A.' }],
      custom: { titleItalics: [[11, 19]] },
    });
  });

  // Text of characters below U+0300 skips normalization; anything above it is still composed.
  it('composes decomposed accents and a dotless i with its accent, and leaves plain Latin text as it is', () => {
    expect(
      plainCsl({
        title: 'Cafe\u0301 training and the \u0131\u0308 of Nai\u0308ve climbers',
        author: [
          { family: 'Mu\u0308ller', given: 'J\u00f8rn' },
          { family: 'Ostby', given: 'Runa' },
        ],
        publisher: 'Kelvin \u212a Press',
      }),
    ).toEqual({
      title: 'Café training and the ï of Naïve climbers',
      author: [
        { family: 'Müller', given: 'Jørn' },
        { family: 'Ostby', given: 'Runa' },
      ],
      publisher: 'Kelvin K Press',
    });
  });
});

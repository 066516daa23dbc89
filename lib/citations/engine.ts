import { Cite, plugins } from '@citation-js/core';
import '@citation-js/plugin-bibtex';
import '@citation-js/plugin-ris';
import '@citation-js/plugin-csl';

/**
 * citation-js, set up once. Importing the plugins registers them with the core.
 *
 * BibTeX titles are brought to sentence case on import (citation-js `parse.sentenceCase:
 * 'english'`): by BibTeX convention titles are typed in title case with {braces} protecting
 * proper nouns and acronyms, and the style decides the case. CSL styles cannot lower-case a
 * title safely, so sentence-case styles print it as stored and the CSL maintainers advise
 * storing titles in sentence case (citation-style-language/styles issue #91); APA wants article
 * titles in sentence case and journal names in title case (American Psychological Association,
 * 2020, Publication Manual, 7th ed., ch. 9). So we store what APA prints; the apa template
 * title-cases the journal itself.
 */
const bibtexConfig = plugins.config.get('@bibtex');
if (bibtexConfig) {
  bibtexConfig.parse.sentenceCase = 'english';
  extendLatex(bibtexConfig.constants as unknown as LatexTables);
}

interface LatexTables {
  commands: Record<string, string>;
  mathCommands: Record<string, string>;
  diacritics: Record<string, string>;
  formattingCommands: Record<string, string | undefined>;
  formattingEnvs: Record<string, string | undefined>;
}

/**
 * Commands real reference-manager exports use that citation-js's tables (plugin-bibtex
 * `constants`, its documented extension point) leave as raw `\TeX`: the TeX logos, spacing and
 * hyphenation hints, ellipses, box commands whose argument is plain text, and the math symbols
 * and accents of sports-science titles (V̇O₂, ±, ×, ≤). Meanings from the LaTeX2e reference manual
 * (latexref.xyz: "Text symbols", "\mbox", "Spacing in horizontal mode", "Math accents", "Math
 * symbols").
 */
function extendLatex(tables: LatexTables) {
  Object.assign(tables.commands, {
    TeX: 'TeX',
    LaTeX: 'LaTeX',
    LaTeXe: 'LaTeX2ε',
    BibTeX: 'BibTeX',
    XeTeX: 'XeTeX',
    relax: '',
    '/': '',
    '-': '',
    '@': '',
    ',': '\u2009',
    ' ': ' ',
    ldots: '…',
    dots: '…',
    aa: 'å',
    AA: 'Å',
    S: '§',
    P: '¶',
    slash: '/',
    emdash: '—',
    endash: '–',
    hyphen: '-',
    nobreakspace: '\u00a0',
    textapprox: '≈',
  });
  Object.assign(tables.mathCommands, {
    times: '×',
    pm: '±',
    mp: '∓',
    cdot: '·',
    leq: '≤',
    le: '≤',
    geq: '≥',
    ge: '≥',
    approx: '≈',
    sim: '∼',
    circ: '°',
    infty: '∞',
    rightarrow: '→',
    to: '→',
    langle: '⟨',
    rangle: '⟩',
    lozenge: '◊',
    log: 'log',
    ln: 'ln',
    exp: 'exp',
  });
  // Math accents combine with the letter after them, like the text accents citation-js knows.
  Object.assign(tables.diacritics, { dot: '\u0307', ddot: '\u0308', bar: '\u0304', hat: '\u0302', tilde: '\u0303' });
  for (const name of ['mbox', 'hbox', 'text', 'textnormal', 'ensuremath', 'NoCaseChange', 'mathrm', 'mathsf', 'mathtt'])
    tables.formattingCommands[name] = undefined;
  Object.assign(tables.formattingCommands, { mathit: 'italics', mathbf: 'bold' });
  // Babel-era script switches (bibcyr: Cyrillic) carry no meaning once the text is Unicode.
  tables.formattingEnvs.bibcyr = undefined;
}

export { Cite, plugins };

/**
 * Input types we hand citation-js. Always forced: left to guess, citation-js treats a pasted
 * URL as something to fetch (synchronously, from the server) — never wanted here.
 */
export const FORCED_TYPES = {
  bibtex: '@biblatex/text',
  ris: '@ris/file',
  csl: '@csl/object',
} as const;

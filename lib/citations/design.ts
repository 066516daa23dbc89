import type { StudyDesign } from '@/lib/scoring/types';
import { cslTitle, type CslItem } from './csl';
import { foldSpaces } from './rich-text';

/**
 * A study design read off a reference's title and keywords, where they say it in so many words
 * ("a randomized controlled trial", "a systematic review and meta-analysis", "a case report").
 * Only ever a suggestion: the coach confirms it before it counts (the library shows it beside
 * the study, docs/scoring.md §1 says what each design starts at). Nothing is guessed from
 * silence: a title that names no design gets no suggestion.
 *
 * The phrases are the design names of the GRADE Handbook (Schünemann et al., eds., 2013, §5)
 * and the study-type wording reporting guidelines ask authors to put in the title (CONSORT 2010
 * item 1a "randomised trial"; STROBE 2007 item 1a "cohort", "case-control", "cross-sectional";
 * PRISMA 2020 item 1 "systematic review", "meta-analysis"; CARE 2013 item 1 "case report").
 */

/**
 * First rule that matches wins, so the order settles titles that name two designs: a review
 * "of randomized trials" is a meta-analysis, a "randomized trial in rats" an animal study, a
 * "nested case-control study within a cohort" a case-control study.
 */
const RULES: readonly [StudyDesign, RegExp][] = [
  [
    'meta-analysis',
    /\bmeta[- ]?analy[sz][ie]s\b|\bsystematic (?:literature )?review\b|\bumbrella review\b|\bpooled analysis\b/,
  ],
  [
    'animal',
    /\b(?:in (?:rats?|mice|rodents?|rabbits?|sheep|pigs?|dogs?|horses?)|(?:rat|mouse|murine|rodent|rabbit|porcine|ovine|canine|equine) (?:model|tendons?|muscles?|study))\b/,
  ],
  ['in-vitro', /\bin[- ]vitro\b|\bcell cultures?\b|\bcultured (?:human )?(?:cells|tenocytes|fibroblasts|myotubes)\b/],
  ['non-randomized', /\bnon[- ]?randomi[sz]ed\b|\bquasi[- ]?(?:experiment(?:al)?|randomi[sz]ed)\b/],
  ['randomized', /\brandomi[sz]ed\b|\brandomi[sz]ation\b|\brct\b|\bcross[- ]?over trial\b/],
  ['case-control', /\bcase[- ]control\b/],
  ['cohort', /\bcohort\b|\bprospective (?:observational )?study\b|\blongitudinal (?:observational )?study\b/],
  ['cross-sectional', /\bcross[- ]sectional\b/],
  ['case-series', /\bcase series\b/],
  ['case-report', /\bcase reports?\b|\bcase study\b|: a case\b/],
  ['expert-opinion', /\bconsensus statement\b|\bexpert (?:opinion|consensus)\b|\bposition (?:stand|statement)\b/],
];

/**
 * All the rules as one pattern, to rule out at once the many titles that name no design: one
 * scan of the text instead of one per rule. Only the order of the rules says which design a
 * title gets, so a text this matches still goes through them one by one.
 */
const ANY_RULE = new RegExp(
  RULES.map(([design, pattern]) => {
    // Flags would be lost in the union: a rule that needs one must be handled apart.
    if (pattern.flags) throw new Error(`The ${design} rule has flags (${pattern.flags}).`);
    return `(?:${pattern.source})`;
  }).join('|'),
);

/** Title and keywords as one text (CSL `keyword` is one string, comma-separated). */
function describedBy(csl: CslItem): string {
  const keywords = typeof csl.keyword === 'string' ? csl.keyword : '';
  return foldSpaces(`${cslTitle(csl) ?? ''} ${keywords}`);
}

/**
 * @example
 * suggestDesign({ title: 'Hangboard loading in trained climbers: a randomised controlled trial' }); // 'randomized'
 * suggestDesign({ title: 'Finger pulley rupture in a boulderer: a case report' }); // 'case-report'
 * suggestDesign({ title: 'Finger strength and climbing grade' }); // null
 */
export function suggestDesign(csl: CslItem): StudyDesign | null {
  const text = describedBy(csl).toLowerCase();
  if (!ANY_RULE.test(text)) return null;
  return RULES.find(([, pattern]) => pattern.test(text))?.[0] ?? null;
}

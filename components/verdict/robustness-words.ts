import { CERTAINTY_LEVELS, PRIOR_CLAMP, VERDICT_LABEL } from '@/lib/scoring/constants';
import { formatNumber } from '@/lib/scoring/format';
import { likelihoodTerm } from '@/lib/scoring/likelihood';
import type { CertaintyLevel, RobustnessDTO, VerdictKey } from '@/lib/reviews/types';

/**
 * The coach's words for what a verdict hangs on (docs/scoring.md §9): one lead sentence and the
 * conditions under which the verdict would change, each a clause that completes "… unless".
 * Pure, so the panel and its tests read the same sentences.
 */

/** A mechanism as the panel names it. */
export interface NamedMechanism {
  id: number;
  name: string;
  stated: boolean;
  term: string;
}

export interface RobustnessWords {
  /** "The verdict stays “Holds up” unless:", or a sentence that needs no list. */
  lead: string;
  /** Each completes "… unless". Empty when nothing a coach can move changes the verdict. */
  conditions: string[];
  /** One line per mechanism: its prior and the priors over which its likelihood term holds. */
  priors: string[];
}

const prior = (x: number) => `${formatNumber(x, 2)} (${likelihoodTerm(x)})`;
const list = (items: string[]) =>
  items.length <= 1 ? items.join('') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
const levelWords = (level: CertaintyLevel) => level.replace('-', ' ');
const oneLevel = (level: CertaintyLevel, by: -1 | 1) =>
  CERTAINTY_LEVELS[Math.max(0, Math.min(CERTAINTY_LEVELS.length - 1, CERTAINTY_LEVELS.indexOf(level) + by))];

/** The outcome prior's bounds as clauses: only the sides that fall inside 0.01…0.99. */
function outcomePriorClauses(r: RobustnessDTO['outcomePrior']): string[] {
  const clauses: string[] = [];
  if (r.low > PRIOR_CLAMP.min) {
    clauses.push(`the outcome’s prior is below ${prior(r.low)}; the review uses ${formatNumber(r.prior, 2)}`);
  }
  if (r.high < PRIOR_CLAMP.max) {
    clauses.push(
      `the outcome’s prior is ${formatNumber(r.high, 2)} (${likelihoodTerm(r.high)}) or more; the review uses ${formatNumber(r.prior, 2)}`,
    );
  }
  return clauses;
}

/**
 * @example
 * robustnessWords(dto, 'supported', mechanisms).lead; // "The verdict stays “Holds up” unless:"
 */
export function robustnessWords(
  r: RobustnessDTO,
  verdict: VerdictKey,
  mechanisms: readonly NamedMechanism[],
): RobustnessWords {
  const label = VERDICT_LABEL[verdict];
  const byId = new Map(mechanisms.map((m) => [m.id, m]));
  const priors = r.mechanismPriors.map((m) => {
    const named = byId.get(m.mechanismId);
    return (
      `${named?.name ?? 'Mechanism'}${named?.stated ? ' (named by the claim)' : ''}: prior ${formatNumber(m.prior, 2)}; ` +
      `it stays “${named?.term ?? likelihoodTerm(m.prior)}” for priors from ${formatNumber(m.low, 2)} to ${formatNumber(m.high, 2)}.`
    );
  });

  if (verdict === 'insufficient') {
    return {
      lead:
        'Not enough evidence yet, so there is nothing to break: leaving studies out only lowers the evidence weight. ' +
        'Appraise more studies.',
      conditions: [],
      priors,
    };
  }

  const conditions: string[] = [];
  const citation = new Map(r.leaveOneOut.map((row) => [row.studyId, row.citation]));
  for (const row of r.leaveOneOut.filter((x) => x.changed)) {
    conditions.push(`${row.citation} is left out (it would read “${VERDICT_LABEL[row.verdict]}”)`);
  }
  if (r.fragility === 2 && r.fragileSet) {
    conditions.push(`${list(r.fragileSet.map((id) => citation.get(id) ?? `study ${id}`))} are both left out`);
  }
  conditions.push(...outcomePriorClauses(r.outcomePrior));
  for (const d of r.decidingCertainty) {
    const target = d.mechanismId === null ? 'the outcome' : (byId.get(d.mechanismId)?.name ?? 'a mechanism');
    for (const by of [-1, 1] as const) {
      const shifted = by === -1 ? d.down : d.up;
      if (shifted === verdict) continue;
      conditions.push(
        `the certainty of ${d.citation} on ${target} is one level ${by === -1 ? 'lower' : 'higher'} ` +
          `(${levelWords(d.certainty)} → ${levelWords(oneLevel(d.certainty, by))}: “${VERDICT_LABEL[shifted]}”)`,
      );
    }
  }
  return {
    lead:
      conditions.length === 0
        ? `The verdict stays “${label}” whichever study or pair of studies is left out, for any outcome prior, and whichever certainty call moves one level.`
        : `The verdict stays “${label}” unless:`,
    conditions,
    priors,
  };
}

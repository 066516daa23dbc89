import { PRIOR_CLAMP } from '@/lib/scoring/constants';
import type { RobustnessDTO, VerdictKey } from '@/lib/reviews/types';
import type { SnapshotRobustness } from './types';

/**
 * What a published verdict rests on and what would change it, in words for athletes
 * (docs/scoring.md §9). Computed once at publish time and kept in the version's snapshot, so an
 * old version keeps saying what it said then.
 */

const pct = (x: number) => `${Math.round(x * 100)} %`;
const list = (items: string[], word = 'and') =>
  items.length <= 1 ? items.join('') : `${items.slice(0, -1).join(', ')} ${word} ${items[items.length - 1]}`;
const studies = (n: number) => `${n} ${n === 1 ? 'study' : 'studies'}`;
const unique = (items: string[]) => [...new Set(items)];

/**
 * @example
 * robustnessPlain(dto, 'supported').restsOn; // 'This verdict rests on one study above all: Hale (2021).'
 */
export function robustnessPlain(r: RobustnessDTO, verdict: VerdictKey): SnapshotRobustness {
  const n = r.leaveOneOut.length;
  const citation = new Map(r.leaveOneOut.map((row) => [row.studyId, row.citation]));
  const pivotal = r.pivotal.map((studyId) => ({ studyId, citation: citation.get(studyId) ?? `study ${studyId}` }));
  const base = { fragility: r.fragility, pivotal };

  if (verdict === 'insufficient') {
    return {
      ...base,
      restsOn: `This verdict rests on too little evidence so far (${studies(n)} appraised).`,
      wouldChange: 'It would change once enough good studies have been weighed to judge the claim either way.',
    };
  }

  let restsOn: string;
  const ifs: string[] = [];
  if (pivotal.length === 1) {
    restsOn = `This verdict rests on one study above all: ${pivotal[0].citation}.`;
    ifs.push('that study were set aside, for example because it was retracted or found to be flawed');
  } else if (pivotal.length > 1) {
    restsOn = `This verdict rests on a few studies it cannot do without: ${list(pivotal.map((p) => p.citation))}.`;
    ifs.push('any one of them were set aside, for example because it was retracted or found to be flawed');
  } else if (r.fragility === 2 && r.fragileSet) {
    restsOn = `This verdict rests on ${studies(n)}; no single one of them decides it.`;
    ifs.push(`two of them, ${list(r.fragileSet.map((id) => citation.get(id) ?? `study ${id}`))}, were both set aside`);
  } else {
    restsOn = `This verdict rests on ${studies(n)}; no single study, and no two together, decide it.`;
  }

  const { low, high } = r.outcomePrior;
  if (low > PRIOR_CLAMP.min) {
    ifs.push(`you started out thinking the promise less than ${pct(low)} likely before looking at any evidence`);
  }
  if (high < PRIOR_CLAMP.max) {
    ifs.push(`you started out thinking the promise more than ${pct(high)} likely before looking at any evidence`);
  }
  const weaker = unique(r.decidingCertainty.filter((d) => d.down !== verdict).map((d) => d.citation));
  const stronger = unique(r.decidingCertainty.filter((d) => d.up !== verdict).map((d) => d.citation));
  if (weaker.length) ifs.push(`the evidence from ${list(weaker, 'or')} were judged one step less trustworthy`);
  if (stronger.length) ifs.push(`the evidence from ${list(stronger, 'or')} were judged one step more trustworthy`);

  const wouldChange =
    ifs.length === 0
      ? 'It would take several studies set aside, or new studies pointing the other way, to change it.'
      : `It would change if ${ifs.join(', or if ')}.`;
  return { ...base, restsOn, wouldChange };
}

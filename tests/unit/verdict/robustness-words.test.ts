import { describe, expect, it } from 'vitest';
import { robustnessWords } from '@/components/verdict/robustness-words';
import type { RobustnessDTO } from '@/lib/reviews/types';

// The coach's "holds unless" sentence (docs/scoring.md §9). Numbers from the §9 worked example:
// outcome prior range low 0.2425; M1 (prior 0.5, p 0.8 "likely") keeps its term for priors
// 0.66/2.02 = 0.3267 … 9/13 = 0.6923.

const r: RobustnessDTO = {
  fragility: 1,
  fragileSet: [11],
  leaveOneOut: [
    { studyId: 11, citation: 'Hale (2021)', verdict: 'insufficient', outcomeProbability: 0.6025, changed: true },
    { studyId: 12, citation: 'Osei (2019)', verdict: 'supported', outcomeProbability: 0.7252, changed: false },
  ],
  pivotal: [11],
  outcomePrior: { prior: 0.5, low: 0.2425, high: 0.99 },
  mechanismPriors: [{ mechanismId: 7, prior: 0.5, low: 0.3267, high: 0.6923 }],
  decidingCertainty: [
    {
      appraisalId: 3,
      studyId: 12,
      citation: 'Osei (2019)',
      mechanismId: 7,
      certainty: 'moderate',
      down: 'other-reasons',
      up: 'supported',
    },
  ],
};
const mechanisms = [{ id: 7, name: 'Tendon stiffness', stated: true, term: 'likely' }];

describe('robustnessWords', () => {
  it('lists the pivotal study, the prior bound in words and numbers, and the deciding certainty call', () => {
    const words = robustnessWords(r, 'supported', mechanisms);
    expect(words.lead).toBe('The verdict stays “Holds up” unless:');
    expect(words.conditions).toEqual([
      'Hale (2021) is left out (it would read “Not enough evidence”)',
      'the outcome’s prior is below 0.24 (unlikely); the review uses 0.5',
      'the certainty of Osei (2019) on Tendon stiffness is one level lower (moderate → low: “Works, but not for the stated reason”)',
    ]);
    expect(words.priors).toEqual([
      'Tendon stiffness (named by the claim): prior 0.5; it stays “likely” for priors from 0.33 to 0.69.',
    ]);
  });

  it('says so when nothing a coach can move changes the verdict', () => {
    const firm: RobustnessDTO = {
      ...r,
      fragility: null,
      fragileSet: null,
      pivotal: [],
      leaveOneOut: r.leaveOneOut.map((row) => ({ ...row, changed: false, verdict: 'supported' })),
      outcomePrior: { prior: 0.5, low: 0.01, high: 0.99 },
      decidingCertainty: [],
    };
    const words = robustnessWords(firm, 'supported', mechanisms);
    expect(words.conditions).toEqual([]);
    expect(words.lead).toMatch(/^The verdict stays “Holds up” whichever study or pair of studies is left out/);
  });

  it('names the pair when two studies together change it', () => {
    const pair: RobustnessDTO = {
      ...r,
      fragility: 2,
      fragileSet: [11, 12],
      pivotal: [],
      leaveOneOut: r.leaveOneOut.map((row) => ({ ...row, changed: false })),
      decidingCertainty: [],
    };
    expect(robustnessWords(pair, 'supported', mechanisms).conditions[0]).toBe(
      'Hale (2021) and Osei (2019) are both left out',
    );
  });
});

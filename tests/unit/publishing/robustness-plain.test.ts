import { describe, expect, it } from 'vitest';
import { robustnessPlain } from '@/lib/publishing/robustness-plain';
import type { RobustnessDTO } from '@/lib/reviews/types';

// The athlete's words for what a verdict rests on (docs/scoring.md §9); the numbers are those of
// the §9 worked example (outcome prior range low 0.2425), the words are ours.

const row = (studyId: number, citation: string, changed: boolean) => ({
  studyId,
  citation,
  verdict: changed ? ('insufficient' as const) : ('supported' as const),
  outcomeProbability: 0.7,
  changed,
});
const dto = (over: Partial<RobustnessDTO> = {}): RobustnessDTO => ({
  fragility: 1,
  fragileSet: [1],
  leaveOneOut: [row(1, 'Hale (2021)', true), row(2, 'Osei (2019)', false), row(3, 'Lund (2020)', false)],
  pivotal: [1],
  outcomePrior: { prior: 0.5, low: 0.2425, high: 0.99 },
  mechanismPriors: [],
  decidingCertainty: [],
  ...over,
});

describe('robustnessPlain', () => {
  it('names the one study a verdict rests on, and the prior that would change it', () => {
    const words = robustnessPlain(dto(), 'supported');
    expect(words.restsOn).toBe('This verdict rests on one study above all: Hale (2021).');
    expect(words.wouldChange).toBe(
      'It would change if that study were set aside, for example because it was retracted or found to be flawed, ' +
        'or if you started out thinking the promise less than 24 % likely before looking at any evidence.',
    );
    expect(words.pivotal).toEqual([{ studyId: 1, citation: 'Hale (2021)' }]);
  });

  it('speaks of two studies together when no single one decides it', () => {
    const words = robustnessPlain(
      dto({
        fragility: 2,
        fragileSet: [2, 3],
        pivotal: [],
        leaveOneOut: [row(1, 'Hale (2021)', false), row(2, 'Osei (2019)', false), row(3, 'Lund (2020)', false)],
        outcomePrior: { prior: 0.5, low: 0.01, high: 0.99 },
      }),
      'supported',
    );
    expect(words.restsOn).toBe('This verdict rests on 3 studies; no single one of them decides it.');
    expect(words.wouldChange).toBe('It would change if two of them, Osei (2019) and Lund (2020), were both set aside.');
  });

  it('says nothing short of several studies would change a verdict that no study or pair decides', () => {
    const words = robustnessPlain(
      dto({
        fragility: null,
        fragileSet: null,
        pivotal: [],
        leaveOneOut: [row(1, 'Hale (2021)', false)],
        outcomePrior: { prior: 0.5, low: 0.01, high: 0.99 },
      }),
      'other-reasons',
    );
    expect(words.restsOn).toBe('This verdict rests on 1 study; no single study, and no two together, decide it.');
    expect(words.wouldChange).toMatch(/^It would take several studies set aside/);
  });

  it('names a certainty call that decides it, and both prior sides of an unsettled verdict', () => {
    const words = robustnessPlain(
      dto({
        fragility: null,
        fragileSet: null,
        pivotal: [],
        outcomePrior: { prior: 0.5, low: 0.3, high: 0.6 },
        decidingCertainty: [
          {
            appraisalId: 9,
            studyId: 2,
            citation: 'Osei (2019)',
            mechanismId: null,
            certainty: 'moderate',
            down: 'uncertain',
            up: 'supported',
          },
        ],
      }),
      'uncertain',
    );
    expect(words.wouldChange).toBe(
      'It would change if you started out thinking the promise less than 30 % likely before looking at any evidence, ' +
        'or if you started out thinking the promise more than 60 % likely before looking at any evidence, ' +
        'or if the evidence from Osei (2019) were judged one step more trustworthy.',
    );
  });

  it('keeps to the evidence still missing when there is not enough of it', () => {
    const words = robustnessPlain(dto({ fragility: null, pivotal: [] }), 'insufficient');
    expect(words.restsOn).toBe('This verdict rests on too little evidence so far (3 studies appraised).');
    expect(words.wouldChange).toMatch(/once enough good studies/);
  });
});

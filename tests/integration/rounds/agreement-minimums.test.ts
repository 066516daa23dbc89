import { describe, expect, it } from 'vitest';
import { assembleAgreement, MIN_AGREEMENT_ITEMS } from '@/lib/rounds/agreement';

/** α and κ get a strength word only with two reviewers and enough mechanisms rated by both. */
const mechanisms = [
  { id: 1, name: 'A', position: 0, engineProbability: 0.5 },
  { id: 2, name: 'B', position: 1, engineProbability: 0.7 },
  { id: 3, name: 'C', position: 2, engineProbability: 0.2 },
];
const card = (reviewerId: number, bands: (number | null)[]) => ({
  reviewerId,
  reviewerName: `R${reviewerId}`,
  ratings: mechanisms.map((m, i) => ({ mechanismId: m.id, band: bands[i], contribution: null, comment: '' })),
});

describe('agreement minimums', () => {
  it('says what is missing instead of a strength word with fewer than 3 rated mechanisms', () => {
    expect(MIN_AGREEMENT_ITEMS).toBe(3);
    const out = assembleAgreement({
      mechanisms,
      scorecards: [card(1, [4, 5, null]), card(2, [4, 4, 2])],
      resolutions: [],
    });
    expect(out.alpha.interpretation).toBeNull();
    expect(out.alpha.missing).toBe(
      'A reading of agreement needs at least 3 mechanisms rated by two reviewers or more; 2 so far.',
    );
    expect(out.kappa).toBeNull();
  });
  it('reads agreement once three mechanisms are rated by both', () => {
    const out = assembleAgreement({
      mechanisms,
      scorecards: [card(1, [4, 5, 1]), card(2, [4, 5, 1])],
      resolutions: [],
    });
    expect(out.alpha.missing).toBeNull();
    expect(out.alpha.interpretation).toBe('reliable');
    expect(out.kappa).not.toBeNull();
  });
});

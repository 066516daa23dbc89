import { describe, expect, it } from 'vitest';
import { assembleAgreement } from '@/lib/rounds/agreement';
import { cohenKappa, krippendorffAlpha } from '@/lib/stats/agreement';

/** Pure: how lib/rounds/agreement.ts lays the ratings out for lib/stats, orders and flags them. */
const mechanisms = [
  { id: 11, name: 'A', position: 0, engineProbability: 0.5 },
  { id: 12, name: 'B', position: 1, engineProbability: 0.95 },
  { id: 13, name: 'C', position: 2, engineProbability: 0.2 },
];
const card = (reviewerId: number, bands: (number | null)[]) => ({
  reviewerId,
  reviewerName: `R${reviewerId}`,
  ratings: mechanisms.map((m, i) => ({ mechanismId: m.id, band: bands[i], contribution: null, comment: '' })),
});

describe('assembleAgreement', () => {
  it('rows are reviewers and columns mechanisms in the review’s order, so α and κ equal lib/stats on that matrix', () => {
    const out = assembleAgreement({
      mechanisms: [...mechanisms].reverse(),
      scorecards: [card(1, [4, 5, 1]), card(2, [4, 2, 2])],
      resolutions: [],
    });
    const matrix = [
      [4, 5, 1],
      [4, 2, 2],
    ];
    expect(out.alpha.ordinal).toBe(krippendorffAlpha(matrix));
    expect(out.kappa?.linear).toBe(
      cohenKappa(matrix[0], matrix[1], { weights: 'linear', categories: [0, 1, 2, 3, 4, 5, 6] }),
    );
    // B spans 3 bands: flagged and first; the rest in the review's order.
    expect(out.mechanisms.map((m) => [m.name, m.flagged, m.span])).toEqual([
      ['B', true, 3],
      ['C', false, 1],
      ['A', false, 0],
    ]);
    // Engine bands from the likelihood scale: 0.95 very likely (5), 0.5 about as likely as not (3).
    expect(out.mechanisms.map((m) => m.engineBand)).toEqual([5, 2, 3]);
    expect(out.unresolvedFlags).toBe(1);
  });

  it('needs two submitted scorecards for α, and has no κ for three reviewers; a missing band is left out, not counted as 0', () => {
    expect(assembleAgreement({ mechanisms, scorecards: [card(1, [1, 2, 3])], resolutions: [] }).alpha).toMatchObject({
      ordinal: null,
      missing: 'Agreement needs at least two submitted scorecards.',
    });
    const three = assembleAgreement({
      mechanisms,
      scorecards: [card(1, [1, null, 3]), card(2, [1, 2, 3]), card(3, [2, 2, 3])],
      resolutions: [],
    });
    expect(three.kappa).toBeNull();
    const b = three.mechanisms.find((m) => m.name === 'B')!;
    expect(b.ratings).toHaveLength(2);
    expect(b.min).toBe(2);
    expect(three.alpha.ordinal).toBe(
      krippendorffAlpha([
        [1, null, 3],
        [1, 2, 3],
        [2, 2, 3],
      ]),
    );
  });

  it('counts a flag with a resolution as settled', () => {
    const out = assembleAgreement({
      mechanisms,
      scorecards: [card(1, [0, 3, 3]), card(2, [6, 3, 3])],
      resolutions: [
        {
          mechanismId: 11,
          kind: 'keep',
          reason: 'Because of reasons given.',
          byId: 1,
          byName: 'X',
          at: '2026-12-01T00:00:00Z',
        },
      ],
    });
    expect(out.flaggedCount).toBe(1);
    expect(out.unresolvedFlags).toBe(0);
    expect(out.mechanisms[0].resolution?.kind).toBe('keep');
  });
});

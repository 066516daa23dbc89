import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { LIKELIHOOD_BANDS, likelihoodBand, likelihoodTerm } from '@/lib/scoring/likelihood';
import { ScoringInputError } from '@/lib/scoring/errors';

// Terms and edges: IPCC AR4 Working Group II likelihood scale; Mastrandrea et al. (2010), AR5
// guidance note. A value on an edge belongs to the higher band and 0.99 is "virtually certain"
// (docs/scoring.md §4 and precise rules; the IPCC text says "> 99 %").
describe('likelihood scale (IPCC AR4 WG II; Mastrandrea et al. 2010)', () => {
  it('lists the seven bands ascending, each from min (included) to the next min (excluded)', () => {
    expect(LIKELIHOOD_BANDS.map((b) => [b.term, b.min, b.max])).toEqual([
      ['exceptionally unlikely', 0, 0.01],
      ['very unlikely', 0.01, 0.1],
      ['unlikely', 0.1, 0.33],
      ['about as likely as not', 0.33, 0.66],
      ['likely', 0.66, 0.9],
      ['very likely', 0.9, 0.99],
      ['virtually certain', 0.99, 1],
    ]);
  });

  it.each([
    [0, 0, 'exceptionally unlikely'],
    [0.0099, 0, 'exceptionally unlikely'],
    [0.01, 1, 'very unlikely'],
    [0.0999, 1, 'very unlikely'],
    [0.1, 2, 'unlikely'],
    [0.3299, 2, 'unlikely'],
    [0.33, 3, 'about as likely as not'],
    [0.5, 3, 'about as likely as not'],
    [0.6599, 3, 'about as likely as not'],
    [0.66, 4, 'likely'],
    [0.8999, 4, 'likely'],
    [0.9, 5, 'very likely'],
    [0.9899, 5, 'very likely'],
    [0.99, 6, 'virtually certain'],
    [1, 6, 'virtually certain'],
  ])('p = %s is band %i, "%s"', (p, band, term) => {
    expect(likelihoodBand(p)).toBe(band);
    expect(likelihoodTerm(p)).toBe(term);
  });

  it('puts just-below-edge values in the lower band (boundary belongs to the higher band)', () => {
    for (let i = 1; i < LIKELIHOOD_BANDS.length; i += 1) {
      const edge = LIKELIHOOD_BANDS[i].min;
      expect(likelihoodBand(edge)).toBe(i);
      expect(likelihoodBand(edge - Number.EPSILON)).toBe(i - 1);
    }
  });

  it('agrees with the band table for any probability (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (p) => {
        const i = likelihoodBand(p);
        const band = LIKELIHOOD_BANDS[i];
        expect(p >= band.min).toBe(true);
        expect(i === 6 ? p <= 1 : p < band.max).toBe(true);
      }),
    );
  });

  it.each([[-0.01], [1.01], [Number.NaN], [Number.POSITIVE_INFINITY]])('rejects p = %s', (p) => {
    expect(() => likelihoodTerm(p)).toThrow(ScoringInputError);
  });
});

import { LIKELIHOOD_SCALE } from './constants';
import { requireFinite } from './validate';
import type { LikelihoodTerm } from './types';

/**
 * One band of the likelihood scale: probabilities from `min` (included) to `max` (excluded; the
 * top band includes 1).
 *
 * @example
 * const band: LikelihoodBand = { term: 'likely', min: 0.66, max: 0.9 };
 */
export interface LikelihoodBand {
  term: LikelihoodTerm;
  min: number;
  max: number;
}

/**
 * The seven bands of the likelihood scale, ascending: index 0 is "exceptionally unlikely" and
 * index 6 "virtually certain". Reviewers rate mechanisms on these indices (the 0…6 scale of
 * docs/scoring.md §7), so the order is part of the contract.
 *
 * @example
 * LIKELIHOOD_BANDS[4]; // { term: 'likely', min: 0.66, max: 0.9 }
 * LIKELIHOOD_BANDS[6].max; // 1 (included)
 */
export const LIKELIHOOD_BANDS: readonly LikelihoodBand[] = Object.freeze(
  LIKELIHOOD_SCALE.map((band, index) =>
    Object.freeze({
      term: band.term,
      min: band.min,
      max: index + 1 < LIKELIHOOD_SCALE.length ? LIKELIHOOD_SCALE[index + 1].min : 1,
    }),
  ),
);

/**
 * Index 0…6 of the band a probability falls in; a value on an edge belongs to the higher band.
 *
 * @example
 * likelihoodBand(0.66); // 4 (likely)
 * likelihoodBand(0.6599); // 3 (about as likely as not)
 * likelihoodBand(1); // 6
 */
export function likelihoodBand(p: number): number {
  requireFinite('probability', p, { min: 0, max: 1 });
  for (let index = LIKELIHOOD_BANDS.length - 1; index > 0; index -= 1) {
    if (p >= LIKELIHOOD_BANDS[index].min) return index;
  }
  return 0;
}

/**
 * The calibrated words for a probability, spelled exactly as docs/scoring.md §4, so that a number is
 * never shown without its meaning.
 *
 * @example
 * likelihoodTerm(0.99); // 'virtually certain'
 * likelihoodTerm(0.5); // 'about as likely as not'
 * likelihoodTerm(0.005); // 'exceptionally unlikely'
 */
export function likelihoodTerm(p: number): LikelihoodTerm {
  return LIKELIHOOD_BANDS[likelihoodBand(p)].term;
}

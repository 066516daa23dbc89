import { ScoringInputError } from '@/lib/scoring/errors';
import { intensityFromLoad, type LoadSpec } from '@/lib/training/dose';
import type { LoadUnit, ProtocolDTO } from './types';

/**
 * The protocol's load on the one scale the scoring uses: a fraction (0…1) of the athlete's
 * maximum for that exercise (docs/scoring.md §2, §3, §8). This file maps the claim form's units onto
 * the engine's `intensityFromLoad` (lib/training/dose.ts) so the conversion lives in one place;
 * it is pure, so the form shows the converted value live and the server scores the same number.
 *
 * Assumptions, stated once:
 * - `percent-max`, `percent-1rm` and `percent-mvc` are already fractions of a maximum:
 *   intensity = value / 100. %1RM (dynamic lifts) and %MVC (isometric efforts) are treated as
 *   one scale, as the trade does when it prescribes either as "intensity" (common practice).
 * - `percent-bodyweight` is the TOTAL load as a percentage of body weight, the way hangboard and
 *   pull-up loads are written ("hang at 120 % BW" = body weight plus 20 %). The athlete's maximum
 *   is body weight plus the most they can add (the reference athlete), so
 *   intensity = (bw · value/100) / (bw + maxAdded) = (bw + added) / (bw + maxAdded).
 * - `kg-added` is the load added to body weight; negative means assistance (a pulley, feet on
 *   the floor): intensity = (bw + added) / (bw + maxAdded) (docs/scoring.md §8).
 * - Body-weight units need the reference athlete (body weight and maximum added load). Without
 *   it, or without a load, the intensity is unknown (null) and the scoring treats the dose as
 *   unknown: no dose penalty, dose match 1 (docs/scoring.md §8).
 * - A load above the reference athlete's maximum, or assistance beyond body weight, is refused
 *   by the form (lib/validation/reviews.ts), so a stored intensity is always within 0…1.
 */

export type ProtocolLoad = Pick<
  ProtocolDTO,
  'loadValue' | 'loadUnit' | 'referenceBodyweightKg' | 'referenceMaxAddedKg'
>;

export const PERCENT_UNITS: readonly LoadUnit[] = ['percent-max', 'percent-1rm', 'percent-mvc'];
export const BODYWEIGHT_UNITS: readonly LoadUnit[] = ['percent-bodyweight', 'kg-added'];

export interface IntensityResult {
  /** Fraction of maximum 0…1, or null when the load cannot be converted. */
  intensity: number | null;
  /** Why it is null, when the load was given but does not fit the scale. */
  problem: 'needs-reference' | 'above-maximum' | 'below-zero' | null;
  /** One sentence a coach can check by hand. */
  explanation: string;
}

const round = (x: number, digits = 3) => Number(x.toFixed(digits));

/** The engine's load spec for a form load, or null when the reference athlete is missing. */
export function loadSpec(load: ProtocolLoad): LoadSpec | null {
  const { loadValue: value, loadUnit: unit, referenceBodyweightKg: bw, referenceMaxAddedKg: maxAdded } = load;
  if (value === null || unit === null) return null;
  switch (unit) {
    case 'percent-max':
    case 'percent-1rm':
      return { unit: 'fraction-1rm', value: value / 100 };
    case 'percent-mvc':
      return { unit: 'fraction-mvc', value: value / 100 };
    case 'percent-bodyweight':
      if (bw === null || maxAdded === null || bw + maxAdded <= 0) return null;
      return { unit: 'fraction-bodyweight', value: value / 100, maxInBodyweights: (bw + maxAdded) / bw };
    case 'kg-added':
      if (bw === null || maxAdded === null || bw + maxAdded <= 0) return null;
      return { unit: 'added-kg', value, bodyweight: bw, maxAddedLoad: maxAdded };
  }
}

/**
 * @example
 * convertLoad({ loadValue: 80, loadUnit: 'percent-1rm', referenceBodyweightKg: null, referenceMaxAddedKg: null }).intensity; // 0.8
 * convertLoad({ loadValue: 10, loadUnit: 'kg-added', referenceBodyweightKg: 70, referenceMaxAddedKg: 30 }).intensity; // 0.8
 */
export function convertLoad(load: ProtocolLoad): IntensityResult {
  const { loadValue: value, loadUnit: unit, referenceBodyweightKg: bw, referenceMaxAddedKg: maxAdded } = load;
  if (value === null || unit === null) {
    return { intensity: null, problem: null, explanation: 'No load given, so the intensity is unknown.' };
  }
  const spec = loadSpec(load);
  if (!spec) {
    return {
      intensity: null,
      problem: 'needs-reference',
      explanation: 'A body-weight load needs the reference athlete (body weight and maximum added load) to convert.',
    };
  }
  let intensity: number;
  try {
    intensity = intensityFromLoad(spec);
  } catch (error) {
    if (!(error instanceof ScoringInputError)) throw error;
    // The engine refuses a load above the maximum and assistance beyond body weight; tell which.
    const below = unit === 'kg-added' ? bw! + value < 0 : value < 0;
    return {
      intensity: null,
      problem: below ? 'below-zero' : 'above-maximum',
      explanation: below
        ? 'The assistance is more than the athlete’s body weight, which leaves no load.'
        : 'The load is above the maximum it is measured against.',
    };
  }
  if (PERCENT_UNITS.includes(unit)) {
    return { intensity, problem: null, explanation: `${value} % of maximum = ${round(intensity)} of maximum.` };
  }
  const total = unit === 'percent-bodyweight' ? (bw! * value) / 100 : bw! + value;
  const added = total - bw!;
  const addedText = added >= 0 ? `${round(added, 1)} kg added` : `${round(-added, 1)} kg of assistance`;
  return {
    intensity,
    problem: null,
    explanation:
      `Total load ${round(total, 1)} kg (${addedText}) over the reference athlete's maximum of ` +
      `${round(bw! + maxAdded!, 1)} kg (${bw} kg body weight + ${maxAdded} kg) = ${round(intensity)} of maximum.`,
  };
}

/** The converted intensity, or null (the shorthand the DTO and the verdict use). */
export function protocolIntensity(load: ProtocolLoad): number | null {
  return convertLoad(load).intensity;
}

import {
  BRZYCKI,
  DEFAULT_DAYS_PER_WEEK,
  DEFAULT_WAKING_HOURS,
  EFFORT_SCALE,
  EPLEY_DIVISOR,
  ONE_REP_MAX_REPS,
} from '../scoring/constants';
import { ScoringInputError } from '../scoring/errors';
import type { Effort } from '../scoring/types';
import {
  requireFinite,
  requireFraction,
  requireInteger,
  requireKey,
  requireObject,
  requireOneOf,
} from '../scoring/validate';

/**
 * Effort levels in the order the protocol form lists them (easy → to failure). The same scale
 * scores a mechanism's effort shortfall, so the form and the model cannot drift apart.
 *
 * @example
 * EFFORT_LEVELS; // ['easy', 'moderate', 'hard', 'to-failure']
 */
export const EFFORT_LEVELS = Object.freeze(Object.keys(EFFORT_SCALE) as Effort[]);

/**
 * Position of an effort level on the 0…3 effort scale (easy 0, moderate 1, hard 2, to failure 3).
 *
 * @example
 * effortValue('hard'); // 2
 */
export function effortValue(effort: Effort): number {
  return EFFORT_SCALE[requireKey('effort', effort, EFFORT_SCALE)];
}

/**
 * Whether a string is one of the effort levels, for narrowing form input.
 *
 * @example
 * isEffort('to-failure'); // true
 * isEffort('max'); // false
 */
export function isEffort(value: unknown): value is Effort {
  return typeof value === 'string' && Object.prototype.hasOwnProperty.call(EFFORT_SCALE, value);
}

/**
 * Estimated one-repetition maximum from a set of `reps` with `weight` (docs/scoring.md §8):
 * Epley w·(1 + r/30) or Brzycki w·36/(37 − r). One repetition is the maximum itself for both.
 * Reps must be a whole number from 1 to 12: beyond that the formulas drift apart quickly.
 *
 * @example
 * oneRepMax(100, 5, 'epley'); // 116.67
 * oneRepMax(100, 5, 'brzycki'); // 112.5
 * oneRepMax(100, 10, 'brzycki'); // 133.33 (the two agree at 10)
 */
export function oneRepMax(weight: number, reps: number, formula: 'epley' | 'brzycki' = 'epley'): number {
  requireFinite('weight', weight, { min: 0, minExclusive: true });
  requireInteger('reps', reps, ONE_REP_MAX_REPS);
  requireOneOf('formula', formula, ['epley', 'brzycki'] as const);
  if (reps === 1) return weight;
  return formula === 'epley'
    ? weight * (1 + reps / EPLEY_DIVISOR)
    : (weight * BRZYCKI.numerator) / (BRZYCKI.offset - reps);
}

/**
 * Load for a hang or isometric pull at a fraction of the athlete's maximum (docs/scoring.md §8):
 * total = (body weight + max added load) × fraction; added = total − body weight. A negative
 * `added` is assistance (a pulley counterweight or feet on the floor). A negative `maxAddedLoad`
 * means the athlete's maximum itself needs assistance.
 *
 * @example
 * hangLoad({ bodyweight: 70, maxAddedLoad: 30, fraction: 0.8 }); // { total: 80, added: 10 }
 * hangLoad({ bodyweight: 70, maxAddedLoad: 10, fraction: 0.5 }); // { total: 40, added: -30 }
 */
export function hangLoad(input: { bodyweight: number; maxAddedLoad: number; fraction: number }): {
  total: number;
  added: number;
} {
  const raw = requireObject('hang load input', input);
  const bodyweight = requireFinite('bodyweight', raw.bodyweight, { min: 0, minExclusive: true });
  const maxAddedLoad = requireFinite('maxAddedLoad', raw.maxAddedLoad);
  const fraction = requireFraction('fraction', raw.fraction);
  const maximum = bodyweight + maxAddedLoad;
  if (maximum <= 0) {
    throw new ScoringInputError('maxAddedLoad', 'body weight plus the maximum added load must be above 0');
  }
  const total = maximum * fraction;
  return { total, added: total - bodyweight };
}

/**
 * Seconds under load in a week: seconds per set × sets per session × sessions per day × days per
 * week (default 7, the daily protocols viral claims favour).
 *
 * @example
 * weeklyTimeUnderLoad({ secondsPerSet: 10, setsPerSession: 6, sessionsPerDay: 2 }); // 840
 * weeklyTimeUnderLoad({ secondsPerSet: 40, setsPerSession: 3, sessionsPerDay: 1, daysPerWeek: 3 }); // 360
 */
export function weeklyTimeUnderLoad(input: {
  secondsPerSet: number;
  setsPerSession: number;
  sessionsPerDay: number;
  daysPerWeek?: number;
}): number {
  const raw = requireObject('time under load input', input);
  const secondsPerSet = requireFinite('secondsPerSet', raw.secondsPerSet, { min: 0 });
  const setsPerSession = requireInteger('setsPerSession', raw.setsPerSession, { min: 1 });
  const sessionsPerDay = requireInteger('sessionsPerDay', raw.sessionsPerDay, { min: 1 });
  const daysPerWeek =
    raw.daysPerWeek === undefined
      ? DEFAULT_DAYS_PER_WEEK
      : requireInteger('daysPerWeek', raw.daysPerWeek, { min: 1, max: 7 });
  return secondsPerSet * setsPerSession * sessionsPerDay * daysPerWeek;
}

/**
 * Whether a day's sessions fit the protocol's minimum rest between them within the waking day:
 * hoursNeeded = (sessions per day − 1) × minimum hours between; ok when that fits in the waking
 * hours (default 16). Rest across nights is not checked: one session a day always fits.
 *
 * @example
 * sessionSpacingOk({ sessionsPerDay: 3, minHoursBetween: 6 }); // { ok: true, hoursNeeded: 12 }
 * sessionSpacingOk({ sessionsPerDay: 4, minHoursBetween: 6 }); // { ok: false, hoursNeeded: 18 }
 */
export function sessionSpacingOk(input: { sessionsPerDay: number; minHoursBetween: number; wakingHours?: number }): {
  ok: boolean;
  hoursNeeded: number;
} {
  const raw = requireObject('session spacing input', input);
  const sessionsPerDay = requireInteger('sessionsPerDay', raw.sessionsPerDay, { min: 1 });
  const minHoursBetween = requireFinite('minHoursBetween', raw.minHoursBetween, { min: 0 });
  const wakingHours =
    raw.wakingHours === undefined
      ? DEFAULT_WAKING_HOURS
      : requireFinite('wakingHours', raw.wakingHours, { min: 0, max: 24, minExclusive: true });
  const hoursNeeded = (sessionsPerDay - 1) * minHoursBetween;
  return { ok: hoursNeeded <= wakingHours, hoursNeeded };
}

/**
 * A load as a protocol or a study states it, with what is needed to put it on the common
 * 0…1 "fraction of the athlete's maximum" scale. All fractions are 0…1.
 *
 * - `fraction-1rm`: fraction of the one-repetition maximum (%1RM / 100).
 * - `fraction-mvc`: fraction of maximum voluntary contraction (%MVC / 100).
 * - `fraction-bodyweight`: the load as a fraction of body weight (a 0.8 hang = feet carrying
 *   20 %), with the athlete's maximum in body weights (1.25 = body weight + 25 %).
 * - `added-kg`: kilograms added to body weight (negative = assistance), with body weight and the
 *   athlete's maximum added load.
 * - `kg`: an external load in kilograms, with the athlete's one-repetition maximum in kilograms.
 *
 * @example
 * const load: LoadSpec = { unit: 'added-kg', value: 10, bodyweight: 70, maxAddedLoad: 30 };
 */
export type LoadSpec =
  | { unit: 'fraction-1rm'; value: number }
  | { unit: 'fraction-mvc'; value: number }
  | { unit: 'fraction-bodyweight'; value: number; maxInBodyweights: number }
  | { unit: 'added-kg'; value: number; bodyweight: number; maxAddedLoad: number }
  | { unit: 'kg'; value: number; oneRepMax: number };

const LOAD_UNITS = ['fraction-1rm', 'fraction-mvc', 'fraction-bodyweight', 'added-kg', 'kg'] as const;

/**
 * Puts a load on the one intensity scale the model uses: a fraction 0…1 of the athlete's
 * maximum for that task.
 *
 * Assumptions, so a coach can check them: %1RM and %MVC are both taken as "fraction of
 * maximum" and treated as one scale, although a dynamic and an isometric maximum differ; % body
 * weight needs the athlete's maximum in body weights; kilograms added need body weight and the
 * maximum added load (the same model as {@link hangLoad}); kilograms need the 1RM. A load above
 * the stated maximum is an error — the maximum is out of date, and intensity above 1 is outside
 * the model.
 *
 * @example
 * intensityFromLoad({ unit: 'fraction-1rm', value: 0.8 }); // 0.8
 * intensityFromLoad({ unit: 'fraction-bodyweight', value: 0.8, maxInBodyweights: 1.25 }); // 0.64
 * intensityFromLoad({ unit: 'added-kg', value: 10, bodyweight: 70, maxAddedLoad: 30 }); // 0.8
 * intensityFromLoad({ unit: 'kg', value: 90, oneRepMax: 120 }); // 0.75
 */
export function intensityFromLoad(load: LoadSpec): number {
  const raw = requireObject('load', load);
  const unit = requireOneOf('load.unit', raw.unit, LOAD_UNITS);
  let intensity: number;
  switch (unit) {
    case 'fraction-1rm':
    case 'fraction-mvc':
      return requireFraction('load.value', raw.value);
    case 'fraction-bodyweight': {
      const value = requireFinite('load.value', raw.value, { min: 0 });
      const max = requireFinite('load.maxInBodyweights', raw.maxInBodyweights, { min: 0, minExclusive: true });
      intensity = value / max;
      break;
    }
    case 'added-kg': {
      const value = requireFinite('load.value', raw.value);
      const bodyweight = requireFinite('load.bodyweight', raw.bodyweight, { min: 0, minExclusive: true });
      const maxAdded = requireFinite('load.maxAddedLoad', raw.maxAddedLoad);
      const maximum = bodyweight + maxAdded;
      if (maximum <= 0) {
        throw new ScoringInputError('load.maxAddedLoad', 'body weight plus the maximum added load must be above 0');
      }
      intensity = (bodyweight + value) / maximum;
      if (intensity < 0) {
        throw new ScoringInputError('load.value', 'assistance larger than body weight leaves no load');
      }
      break;
    }
    case 'kg': {
      const value = requireFinite('load.value', raw.value, { min: 0 });
      const max = requireFinite('load.oneRepMax', raw.oneRepMax, { min: 0, minExclusive: true });
      intensity = value / max;
      break;
    }
  }
  if (intensity > 1) {
    throw new ScoringInputError(
      'load.value',
      `is above the athlete's stated maximum (intensity ${intensity.toFixed(3)}); update the maximum`,
    );
  }
  return intensity;
}

/**
 * The inverse of {@link intensityFromLoad}: the load to set for a target intensity, in the unit
 * of `spec` (whose `value` is ignored).
 *
 * @example
 * loadForIntensity(0.64, { unit: 'fraction-bodyweight', value: 0, maxInBodyweights: 1.25 }); // 0.8
 * loadForIntensity(0.5, { unit: 'added-kg', value: 0, bodyweight: 70, maxAddedLoad: 10 }); // -30
 * loadForIntensity(0.75, { unit: 'kg', value: 0, oneRepMax: 120 }); // 90
 */
export function loadForIntensity(intensity: number, spec: LoadSpec): number {
  requireFraction('intensity', intensity);
  const raw = requireObject('load', spec);
  const unit = requireOneOf('load.unit', raw.unit, LOAD_UNITS);
  switch (unit) {
    case 'fraction-1rm':
    case 'fraction-mvc':
      return intensity;
    case 'fraction-bodyweight':
      return intensity * requireFinite('load.maxInBodyweights', raw.maxInBodyweights, { min: 0, minExclusive: true });
    case 'added-kg':
      return hangLoad({
        bodyweight: raw.bodyweight as number,
        maxAddedLoad: raw.maxAddedLoad as number,
        fraction: intensity,
      }).added;
    case 'kg':
      return intensity * requireFinite('load.oneRepMax', raw.oneRepMax, { min: 0, minExclusive: true });
  }
}

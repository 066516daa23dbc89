import { ScoringInputError } from './errors';

/**
 * Guards shared by the three model folders. Each returns the value typed as checked, or throws a
 * {@link ScoringInputError} naming the field, so a bad value never travels on as NaN.
 *
 * @example
 * const n = requireInteger('n1', 12, { min: 2 }); // 12
 *
 * @module
 */

const describe = (value: unknown): string => {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number' || typeof value === 'boolean' || value == null) return String(value);
  return typeof value;
};

/**
 * A finite number (no NaN, no ±Infinity), optionally inside bounds.
 *
 * @example
 * requireFinite('bodyweight', 72.5, { min: 0, minExclusive: true }); // 72.5
 */
export function requireFinite(
  field: string,
  value: unknown,
  bounds: { min?: number; max?: number; minExclusive?: boolean; maxExclusive?: boolean } = {},
): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ScoringInputError(field, `must be a finite number, got ${describe(value)}`);
  }
  const { min, max, minExclusive = false, maxExclusive = false } = bounds;
  if (min !== undefined && (minExclusive ? value <= min : value < min)) {
    throw new ScoringInputError(field, `must be ${minExclusive ? 'greater than' : 'at least'} ${min}, got ${value}`);
  }
  if (max !== undefined && (maxExclusive ? value >= max : value > max)) {
    throw new ScoringInputError(field, `must be ${maxExclusive ? 'less than' : 'at most'} ${max}, got ${value}`);
  }
  return value;
}

/**
 * A fraction of a maximum: finite and inside 0…1 (both ends allowed).
 *
 * @example
 * requireFraction('intensity', 0.8); // 0.8
 */
export function requireFraction(field: string, value: unknown): number {
  return requireFinite(field, value, { min: 0, max: 1 });
}

/**
 * A whole number, optionally inside bounds.
 *
 * @example
 * requireInteger('reps', 5, { min: 1, max: 12 }); // 5
 */
export function requireInteger(field: string, value: unknown, bounds: { min?: number; max?: number } = {}): number {
  const n = requireFinite(field, value, bounds);
  if (!Number.isInteger(n)) throw new ScoringInputError(field, `must be a whole number, got ${n}`);
  return n;
}

/**
 * One of a fixed set of spellings. The allowed values are listed in the message because a typo
 * ("to failure" for "to-failure") is the usual cause.
 *
 * @example
 * requireOneOf('effort', 'hard', ['easy', 'moderate', 'hard', 'to-failure'] as const); // 'hard'
 */
export function requireOneOf<const T extends string>(field: string, value: unknown, allowed: readonly T[]): T {
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    throw new ScoringInputError(
      field,
      `must be one of ${allowed.map((a) => `'${a}'`).join(', ')}, got ${describe(value)}`,
    );
  }
  return value as T;
}

/**
 * A key of a lookup table, as a fast check for hot loops (one property read, no array scan).
 *
 * @example
 * requireKey('certainty', 'high', { high: 1, low: 0.3 }); // 'high'
 */
export function requireKey<T extends Record<string, unknown>>(
  field: string,
  value: unknown,
  table: T,
): keyof T & string {
  if (typeof value !== 'string' || !Object.prototype.hasOwnProperty.call(table, value)) {
    throw new ScoringInputError(
      field,
      `must be one of ${Object.keys(table)
        .map((a) => `'${a}'`)
        .join(', ')}, got ${describe(value)}`,
    );
  }
  return value;
}

/**
 * A boolean, or undefined when the input is optional.
 *
 * @example
 * optionalBoolean('doseResponse', true); // true
 */
export function optionalBoolean(field: string, value: unknown): boolean | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'boolean') {
    throw new ScoringInputError(field, `must be true or false, got ${describe(value)}`);
  }
  return value;
}

/**
 * An array (possibly empty).
 *
 * @example
 * requireArray('evidence', []); // []
 */
export function requireArray<T = unknown>(field: string, value: unknown): readonly T[] {
  if (!Array.isArray(value)) throw new ScoringInputError(field, `must be an array, got ${describe(value)}`);
  return value as readonly T[];
}

/**
 * A plain object, so that destructuring a missing argument gives a clear message instead of a
 * TypeError deep inside the model.
 *
 * @example
 * requireObject('input', { design: 'randomized' });
 */
export function requireObject(field: string, value: unknown): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new ScoringInputError(field, `must be an object, got ${describe(value)}`);
  }
  return value as Record<string, unknown>;
}

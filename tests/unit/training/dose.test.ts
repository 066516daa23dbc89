import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  EFFORT_LEVELS,
  effortValue,
  hangLoad,
  intensityFromLoad,
  isEffort,
  loadForIntensity,
  oneRepMax,
  sessionSpacingOk,
  weeklyTimeUnderLoad,
  type LoadSpec,
} from '@/lib/training/dose';
import { EFFORT_SCALE } from '@/lib/scoring/constants';
import { ScoringInputError } from '@/lib/scoring/errors';

describe('oneRepMax — Epley (1985) w·(1 + r/30); Brzycki (1993, JOPERD) w·36/(37 − r)', () => {
  it.each([
    [100, 5, 'epley', 116.67],
    [100, 5, 'brzycki', 112.5],
    [100, 10, 'epley', 133.33],
    [100, 10, 'brzycki', 133.33],
  ] as const)(
    '%s kg × %i reps, %s → %s (the formulas worked by hand, 2 decimals)',
    (weight, reps, formula, published) => {
      expect(Math.abs(oneRepMax(weight, reps, formula) - published)).toBeLessThanOrEqual(0.005);
    },
  );

  it('returns the weight itself for one repetition, with both formulas (docs/scoring.md)', () => {
    expect(oneRepMax(142.5, 1, 'epley')).toBe(142.5);
    expect(oneRepMax(142.5, 1, 'brzycki')).toBe(142.5);
  });

  it('defaults to Epley', () => {
    expect(oneRepMax(80, 6)).toBe(oneRepMax(80, 6, 'epley'));
  });

  it('grows with reps for both formulas (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 500, noNaN: true }),
        fc.integer({ min: 1, max: 11 }),
        fc.constantFrom('epley', 'brzycki' as const),
        (w, r, f) => {
          expect(oneRepMax(w, r + 1, f)).toBeGreaterThan(oneRepMax(w, r, f));
          expect(oneRepMax(w, r, f)).toBeGreaterThanOrEqual(w);
        },
      ),
    );
  });

  it.each([
    [() => oneRepMax(100, 0), 'reps'],
    [() => oneRepMax(100, 13), 'reps'],
    [() => oneRepMax(100, 2.5), 'reps'],
    [() => oneRepMax(0, 5), 'weight'],
    [() => oneRepMax(-10, 5), 'weight'],
    [() => oneRepMax(100, 5, 'lombardi' as unknown as 'epley'), 'formula'],
  ])('rejects bad input (case %#) naming %s', (call, field) => {
    expect(call).toThrow(expect.objectContaining({ name: 'ScoringInputError', field }));
  });
});

describe('hangLoad — total = (body weight + max added) × fraction; added = total − body weight (docs/scoring.md §8)', () => {
  it.each([
    [{ bodyweight: 70, maxAddedLoad: 30, fraction: 0.8 }, 80, 10],
    [{ bodyweight: 70, maxAddedLoad: 30, fraction: 0.7 }, 70, 0],
    [{ bodyweight: 70, maxAddedLoad: 10, fraction: 0.5 }, 40, -30], // assistance
    [{ bodyweight: 60, maxAddedLoad: -10, fraction: 1 }, 50, -10], // maximum itself assisted
    [{ bodyweight: 80, maxAddedLoad: 0, fraction: 0 }, 0, -80],
  ])('%o → total %s, added %s', (input, total, added) => {
    const r = hangLoad(input);
    expect(r.total).toBeCloseTo(total, 12);
    expect(r.added).toBeCloseTo(added, 12);
  });

  it.each([
    [{ bodyweight: 0, maxAddedLoad: 10, fraction: 0.5 }, 'bodyweight'],
    [{ bodyweight: 70, maxAddedLoad: -70, fraction: 0.5 }, 'maxAddedLoad'],
    [{ bodyweight: 70, maxAddedLoad: 10, fraction: 80 }, 'fraction'],
    [{ bodyweight: 70, maxAddedLoad: Number.NaN, fraction: 0.8 }, 'maxAddedLoad'],
  ])('rejects %o', (input, field) => {
    expect(() => hangLoad(input)).toThrow(expect.objectContaining({ name: 'ScoringInputError', field }));
  });
});

describe('weeklyTimeUnderLoad and sessionSpacingOk (docs/scoring.md)', () => {
  it('multiplies seconds × sets × sessions per day × days (default 7)', () => {
    expect(weeklyTimeUnderLoad({ secondsPerSet: 10, setsPerSession: 6, sessionsPerDay: 2 })).toBe(840);
    expect(weeklyTimeUnderLoad({ secondsPerSet: 40, setsPerSession: 3, sessionsPerDay: 1, daysPerWeek: 3 })).toBe(360);
  });

  it.each([
    [{ sessionsPerDay: 1, minHoursBetween: 48 }, true, 0],
    [{ sessionsPerDay: 3, minHoursBetween: 6 }, true, 12],
    [{ sessionsPerDay: 3, minHoursBetween: 8 }, true, 16], // exactly the waking day
    [{ sessionsPerDay: 4, minHoursBetween: 6 }, false, 18],
    [{ sessionsPerDay: 4, minHoursBetween: 6, wakingHours: 18 }, true, 18],
    [{ sessionsPerDay: 2, minHoursBetween: 10, wakingHours: 8 }, false, 10],
  ])('%o → ok %s, hours needed %s', (input, ok, hoursNeeded) => {
    expect(sessionSpacingOk(input)).toEqual({ ok, hoursNeeded });
  });

  it.each([
    [() => weeklyTimeUnderLoad({ secondsPerSet: -1, setsPerSession: 1, sessionsPerDay: 1 }), 'secondsPerSet'],
    [() => weeklyTimeUnderLoad({ secondsPerSet: 10, setsPerSession: 0, sessionsPerDay: 1 }), 'setsPerSession'],
    [() => weeklyTimeUnderLoad({ secondsPerSet: 10, setsPerSession: 1, sessionsPerDay: 1.5 }), 'sessionsPerDay'],
    [
      () => weeklyTimeUnderLoad({ secondsPerSet: 10, setsPerSession: 1, sessionsPerDay: 1, daysPerWeek: 8 }),
      'daysPerWeek',
    ],
    [() => sessionSpacingOk({ sessionsPerDay: 0, minHoursBetween: 4 }), 'sessionsPerDay'],
    [() => sessionSpacingOk({ sessionsPerDay: 2, minHoursBetween: -4 }), 'minHoursBetween'],
    [() => sessionSpacingOk({ sessionsPerDay: 2, minHoursBetween: 4, wakingHours: 25 }), 'wakingHours'],
  ])('rejects bad input (case %#) naming %s', (call, field) => {
    expect(call).toThrow(expect.objectContaining({ name: 'ScoringInputError', field }));
  });
});

describe('effort levels', () => {
  it('lists the four levels in order and maps them onto the scoring effort scale', () => {
    expect(EFFORT_LEVELS).toEqual(['easy', 'moderate', 'hard', 'to-failure']);
    expect(EFFORT_LEVELS.map(effortValue)).toEqual([0, 1, 2, 3]);
    for (const level of EFFORT_LEVELS) expect(effortValue(level)).toBe(EFFORT_SCALE[level]);
  });

  it('narrows strings', () => {
    expect(isEffort('to-failure')).toBe(true);
    expect(isEffort('to failure')).toBe(false);
    expect(isEffort(3)).toBe(false);
    expect(() => effortValue('max' as unknown as 'hard')).toThrow(ScoringInputError);
  });
});

describe('intensity conversions onto one 0…1 scale (assumptions documented in lib/training/dose.ts)', () => {
  it.each([
    [{ unit: 'fraction-1rm', value: 0.8 }, 0.8],
    [{ unit: 'fraction-mvc', value: 0.4 }, 0.4],
    [{ unit: 'fraction-bodyweight', value: 0.8, maxInBodyweights: 1.25 }, 0.64],
    [{ unit: 'fraction-bodyweight', value: 1, maxInBodyweights: 1 }, 1],
    [{ unit: 'added-kg', value: 10, bodyweight: 70, maxAddedLoad: 30 }, 0.8],
    [{ unit: 'added-kg', value: -30, bodyweight: 70, maxAddedLoad: 10 }, 0.5],
    [{ unit: 'kg', value: 90, oneRepMax: 120 }, 0.75],
  ] as const)('%o → %s', (load, intensity) => {
    expect(intensityFromLoad(load as LoadSpec)).toBeCloseTo(intensity, 12);
  });

  it('agrees with hangLoad: the added load for a fraction converts back to that fraction (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 30, max: 150, noNaN: true }),
        fc.double({ min: -20, max: 80, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (bodyweight, maxAddedLoad, fraction) => {
          const { added } = hangLoad({ bodyweight, maxAddedLoad, fraction });
          const back = intensityFromLoad({ unit: 'added-kg', value: added, bodyweight, maxAddedLoad });
          expect(back).toBeCloseTo(fraction, 9);
          expect(loadForIntensity(fraction, { unit: 'added-kg', value: 0, bodyweight, maxAddedLoad })).toBeCloseTo(
            added,
            9,
          );
        },
      ),
    );
  });

  it('inverts with loadForIntensity for every unit', () => {
    const specs: LoadSpec[] = [
      { unit: 'fraction-1rm', value: 0 },
      { unit: 'fraction-mvc', value: 0 },
      { unit: 'fraction-bodyweight', value: 0, maxInBodyweights: 1.4 },
      { unit: 'kg', value: 0, oneRepMax: 150 },
    ];
    for (const spec of specs) {
      const load = loadForIntensity(0.65, spec);
      expect(intensityFromLoad({ ...spec, value: load } as LoadSpec)).toBeCloseTo(0.65, 12);
    }
  });

  it.each([
    [{ unit: 'fraction-1rm', value: 80 }, 'load.value'], // a percentage, not a fraction
    [{ unit: 'kg', value: 130, oneRepMax: 120 }, 'load.value'], // above the stated maximum
    [{ unit: 'fraction-bodyweight', value: 0.8 }, 'load.maxInBodyweights'],
    [{ unit: 'added-kg', value: 10, bodyweight: 70 }, 'load.maxAddedLoad'],
    [{ unit: 'added-kg', value: -80, bodyweight: 70, maxAddedLoad: 10 }, 'load.value'],
    [{ unit: 'kg', value: 50, oneRepMax: 0 }, 'load.oneRepMax'],
    [{ unit: 'percent', value: 0.5 }, 'load.unit'],
  ])('rejects %o', (load, field) => {
    expect(() => intensityFromLoad(load as unknown as LoadSpec)).toThrow(
      expect.objectContaining({ name: 'ScoringInputError', field }),
    );
  });
});

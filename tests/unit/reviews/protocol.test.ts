import { describe, expect, it } from 'vitest';
import { convertLoad, protocolIntensity, type ProtocolLoad } from '@/lib/reviews/protocol';
import { protocolSchema } from '@/lib/validation/reviews';

const load = (
  loadValue: number | null,
  loadUnit: ProtocolLoad['loadUnit'],
  bw: number | null = null,
  maxAdded: number | null = null,
): ProtocolLoad => ({
  loadValue,
  loadUnit,
  referenceBodyweightKg: bw,
  referenceMaxAddedKg: maxAdded,
});

describe('protocol load → fraction of maximum', () => {
  it('takes %max, %1RM and %MVC as value / 100', () => {
    expect(protocolIntensity(load(30, 'percent-max'))).toBeCloseTo(0.3, 12);
    expect(protocolIntensity(load(80, 'percent-1rm'))).toBeCloseTo(0.8, 12);
    expect(protocolIntensity(load(100, 'percent-mvc'))).toBe(1);
  });

  it('puts kg added on the reference athlete: (bw + added) / (bw + maxAdded)', () => {
    // 70 kg climber who can hang +30 kg: +10 kg is 80 of 100 kg (docs/scoring.md §8 example: hangLoad 0.8 → +10 kg).
    expect(protocolIntensity(load(10, 'kg-added', 70, 30))).toBeCloseTo(0.8, 12);
    // Assistance: a 20 kg pulley counterweight leaves 50 of 100 kg.
    expect(protocolIntensity(load(-20, 'kg-added', 70, 30))).toBeCloseTo(0.5, 12);
    // Pull-up ladder of the demo: +15 kg for a 70 kg athlete with a +35 kg maximum = 85 / 105.
    expect(protocolIntensity(load(15, 'kg-added', 70, 35))).toBeCloseTo(85 / 105, 12);
  });

  it('reads % body weight as the total load: 120 % BW for a 70 kg athlete with +30 kg max is 84 / 100', () => {
    expect(protocolIntensity(load(120, 'percent-bodyweight', 70, 30))).toBeCloseTo(0.84, 12);
    // 100 % BW = body weight only = bw / (bw + maxAdded).
    expect(protocolIntensity(load(100, 'percent-bodyweight', 80, 20))).toBeCloseTo(0.8, 12);
    // The same load written both ways gives the same intensity.
    expect(protocolIntensity(load(125, 'percent-bodyweight', 80, 20))).toBeCloseTo(
      protocolIntensity(load(20, 'kg-added', 80, 20))!,
      12,
    );
  });

  it('is unknown (null) without a load or without the reference athlete, and says why', () => {
    expect(convertLoad(load(null, null))).toMatchObject({ intensity: null, problem: null });
    expect(convertLoad(load(10, 'kg-added'))).toMatchObject({ intensity: null, problem: 'needs-reference' });
    expect(convertLoad(load(110, 'percent-bodyweight', 70, null))).toMatchObject({
      intensity: null,
      problem: 'needs-reference',
    });
  });

  it('refuses a load above the maximum and assistance beyond body weight', () => {
    expect(convertLoad(load(40, 'kg-added', 70, 30))).toMatchObject({ intensity: null, problem: 'above-maximum' });
    expect(convertLoad(load(-80, 'kg-added', 70, 30))).toMatchObject({ intensity: null, problem: 'below-zero' });
  });

  it('explains the conversion in numbers a coach can check', () => {
    expect(convertLoad(load(10, 'kg-added', 70, 30)).explanation).toBe(
      "Total load 80 kg (10 kg added) over the reference athlete's maximum of 100 kg (70 kg body weight + 30 kg) = 0.8 of maximum.",
    );
    expect(convertLoad(load(-20, 'kg-added', 70, 30)).explanation).toContain('20 kg of assistance');
  });
});

describe('protocol form validation', () => {
  const base = { exercise: 'Pinch-block lift' };
  const issues = (input: object) => {
    const result = protocolSchema.safeParse({ ...base, ...input });
    return result.success ? [] : result.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
  };

  it('fills every unset field with null and accepts a load with its unit', () => {
    const parsed = protocolSchema.parse({ ...base, loadValue: 30, loadUnit: 'percent-max' });
    expect(parsed).toMatchObject({
      exercise: 'Pinch-block lift',
      loadValue: 30,
      loadUnit: 'percent-max',
      weeks: null,
      effort: null,
    });
  });

  it('asks for the unit with a load and the load with a unit', () => {
    expect(issues({ loadValue: 30 })).toEqual(['loadUnit: Choose the unit of the load.']);
    expect(issues({ loadUnit: 'percent-1rm' })).toEqual(['loadValue: Enter the load for that unit.']);
  });

  it('keeps percentages within 0–100 (body weight up to 300)', () => {
    expect(issues({ loadValue: 120, loadUnit: 'percent-1rm' })).toEqual([
      'loadValue: A percentage of maximum is above 0 and at most 100.',
    ]);
    expect(issues({ loadValue: 0, loadUnit: 'percent-max' })).toHaveLength(1);
    expect(
      issues({ loadValue: 301, loadUnit: 'percent-bodyweight', referenceBodyweightKg: 70, referenceMaxAddedKg: 200 }),
    ).toHaveLength(1);
  });

  it('needs the reference athlete for body-weight units and refuses a load beyond the maximum', () => {
    expect(issues({ loadValue: 10, loadUnit: 'kg-added' })).toEqual([
      'referenceBodyweightKg: A body-weight load needs the reference athlete’s body weight.',
      'referenceMaxAddedKg: A body-weight load needs the reference athlete’s maximum added load.',
    ]);
    expect(issues({ loadValue: 40, loadUnit: 'kg-added', referenceBodyweightKg: 70, referenceMaxAddedKg: 30 })).toEqual(
      [
        'loadValue: That load is above the reference athlete’s maximum; raise their maximum added load or lower the load.',
      ],
    );
    expect(
      issues({ loadValue: -75, loadUnit: 'kg-added', referenceBodyweightKg: 70, referenceMaxAddedKg: 30 }),
    ).toEqual(['loadValue: The assistance is more than the athlete’s body weight.']);
    expect(issues({ loadValue: 15, loadUnit: 'kg-added', referenceBodyweightKg: 70, referenceMaxAddedKg: 35 })).toEqual(
      [],
    );
  });

  it('checks the other dose fields: whole sets, 1–7 days, known effort', () => {
    expect(issues({ setsPerSession: 2.5 })).toEqual(['setsPerSession: Sets must be a whole number.']);
    expect(issues({ daysPerWeek: 8 })).toEqual(['daysPerWeek: At most 7 days a week.']);
    expect(issues({ effort: 'max' })[0]).toMatch(/^effort: Effort must be one of/);
    expect(issues({ exercise: '  ' })).toEqual(['exercise: Name the exercise.']);
  });
});

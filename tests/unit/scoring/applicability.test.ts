import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { explainApplicability, suggestApplicability, type ApplicabilityInput } from '@/lib/scoring/applicability';
import { ScoringInputError } from '@/lib/scoring/errors';

// All rules: docs/scoring.md §2 and its precise rules (our model).

describe('suggestApplicability — population match', () => {
  it.each([
    ['untrained', 'untrained', 1],
    ['trained', 'trained', 1],
    ['untrained', 'recreational', 0.75],
    ['elite', 'trained', 0.75],
    ['untrained', 'trained', 0.5],
    ['recreational', 'elite', 0.5],
    ['untrained', 'elite', 0.5],
  ] as const)('%s study for a %s target → %s', (studyPopulation, targetPopulation, expected) => {
    const result = explainApplicability({ studyPopulation, targetPopulation });
    expect(result.populationMatch).toBe(expected);
    expect(result.doseMatch).toBe(1);
    expect(result.applicability).toBe(expected);
  });

  it.each([
    [{ studyInjured: true, targetInjured: false }, 'trained', 'trained', 0.75],
    [{ studyInjured: false, targetInjured: true }, 'trained', 'trained', 0.75],
    [{ studyInjured: true, targetInjured: true }, 'trained', 'trained', 1],
    [{ studyInjured: true }, 'recreational', 'trained', 0.5],
    [{ targetInjured: true }, 'untrained', 'elite', 0.5],
  ] as const)(
    'injury %o with %s/%s counts one extra level → %s',
    (flags, studyPopulation, targetPopulation, expected) => {
      expect(suggestApplicability({ studyPopulation, targetPopulation, ...flags })).toBe(expected);
    },
  );

  it('treats an unset injured flag as healthy', () => {
    expect(suggestApplicability({ studyPopulation: 'elite', targetPopulation: 'elite', studyInjured: false })).toBe(1);
  });

  it.each([
    [{ targetPopulation: 'elite' }],
    [{ studyPopulation: 'untrained' }],
    [{}],
    // An unknown population gives 1.0 even when the injury flags differ (precise rules, read literally).
    [{ studyPopulation: 'untrained', studyInjured: true }],
  ] as const)('gives population match 1 when a population is unknown: %o', (input) => {
    expect(explainApplicability(input as ApplicabilityInput).populationMatch).toBe(1);
  });
});

describe('suggestApplicability — dose match', () => {
  it.each([
    [0.8, 0.8, 1],
    [0.4, 0.8, 0.5],
    [0.8, 0.4, 0.5],
    [0.6, 0.8, 0.75],
    [0.3, 0.9, 1 - 0.6 / 0.9],
    [0.1, 1, 0.1], // 1 − 0.9 = 0.1, exactly the floor
    [0.05, 0.9, 0.1], // 0.0556 raised to the floor
    [0, 0.5, 0.1], // 0 raised to the floor
    [0, 0, 1], // both zero
  ])('study %s vs protocol %s → %s', (studyIntensity, protocolIntensity, expected) => {
    const result = explainApplicability({ studyIntensity, protocolIntensity });
    expect(result.doseMatch).toBeCloseTo(expected, 12);
    expect(result.populationMatch).toBe(1);
  });

  it.each([[{ studyIntensity: 0.5 }], [{ protocolIntensity: 0.5 }], [{}]])(
    'is 1 when an intensity is unknown: %o',
    (input) => {
      expect(explainApplicability(input).doseMatch).toBe(1);
    },
  );
});

describe('suggestApplicability — product and reasons', () => {
  it('multiplies population and dose match', () => {
    const result = explainApplicability({
      studyPopulation: 'recreational',
      targetPopulation: 'trained',
      studyIntensity: 0.4,
      protocolIntensity: 0.8,
    });
    expect(result.applicability).toBeCloseTo(0.75 * 0.5, 12);
    expect(result.text).toContain('0.75 × 0.5 = 0.375');
    expect(result.populationReason).toContain('1 level apart');
    expect(result.doseReason).toContain('1 − |0.4 − 0.8| / 0.8 = 0.5');
  });

  it('stays within (0, 1] and equals the product of its factors (property)', () => {
    const status = fc.constantFrom('untrained', 'recreational', 'trained', 'elite', undefined);
    const intensity = fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { nil: undefined });
    const flag = fc.option(fc.boolean(), { nil: undefined });
    fc.assert(
      fc.property(status, status, flag, flag, intensity, intensity, (sp, tp, si, ti, sI, pI) => {
        const result = explainApplicability({
          studyPopulation: sp,
          targetPopulation: tp,
          studyInjured: si,
          targetInjured: ti,
          studyIntensity: sI,
          protocolIntensity: pI,
        });
        expect(result.applicability).toBeGreaterThan(0);
        expect(result.applicability).toBeLessThanOrEqual(1);
        expect(result.applicability).toBe(result.populationMatch * result.doseMatch);
        expect(result.doseMatch).toBeGreaterThanOrEqual(0.1);
        expect([1, 0.75, 0.5]).toContain(result.populationMatch);
      }),
    );
  });

  it.each([
    [{ studyPopulation: 'pro' }, 'studyPopulation'],
    [{ targetPopulation: 'Elite' }, 'targetPopulation'],
    [{ studyInjured: 'no' }, 'studyInjured'],
    [{ studyIntensity: 1.2 }, 'studyIntensity'],
    [{ protocolIntensity: -0.1 }, 'protocolIntensity'],
    [{ protocolIntensity: Number.NaN }, 'protocolIntensity'],
  ])('rejects %o', (input, field) => {
    expect(() => suggestApplicability(input as unknown as ApplicabilityInput)).toThrow(
      expect.objectContaining({ name: 'ScoringInputError', field }),
    );
    expect(() => suggestApplicability(input as unknown as ApplicabilityInput)).toThrow(ScoringInputError);
  });
});

import { describe, expect, it } from 'vitest';
import { gradeCertainty, largeEffectFromRiskRatio, type CertaintyInput } from '@/lib/scoring/certainty';
import { ScoringInputError } from '@/lib/scoring/errors';

// GRADE: Schünemann et al., eds., GRADE Handbook (2013); Guyatt et al. 2011, J Clin Epidemiol 64
// (GRADE guidelines series). Randomized evidence starts high, observational low; each domain
// rates down one level (serious) or two (very serious); rating up for large effect (+1 / +2),
// dose-response (+1) and confounding that would reduce the effect (+1), only for evidence not
// already rated down. The starts of case series, reports, expert opinion, animal and in-vitro
// work and the "start ≤ 2" rule for upgrading are docs/scoring.md §1.

describe('gradeCertainty — starting level by design (GRADE Handbook 2013; docs/scoring.md §1)', () => {
  it.each([
    ['meta-analysis', 4, 'high'],
    ['randomized', 4, 'high'],
    ['non-randomized', 2, 'low'],
    ['cohort', 2, 'low'],
    ['case-control', 2, 'low'],
    ['cross-sectional', 2, 'low'],
    ['case-series', 1, 'very-low'],
    ['case-report', 1, 'very-low'],
    ['expert-opinion', 1, 'very-low'],
  ] as const)('%s starts at %i (%s) with one step', (design, score, level) => {
    const result = gradeCertainty({ design });
    expect(result.score).toBe(score);
    expect(result.level).toBe(level);
    expect(result.steps).toHaveLength(1);
    expect(result.steps[0]).toMatchObject({ domain: 'design', change: score, score });
  });

  it.each(['animal', 'in-vitro'] as const)(
    '%s starts at 4 but indirectness is forced to very serious (a −2 step) → low',
    (design) => {
      const result = gradeCertainty({ design });
      expect(result.score).toBe(2);
      expect(result.level).toBe('low');
      expect(result.steps.map((s) => [s.domain, s.change, s.score])).toEqual([
        ['design', 4, 4],
        ['indirectness', -2, 2],
      ]);
    },
  );

  it.each(['none', 'serious', 'very-serious'] as const)(
    'animal work with indirectness given as %s still counts it as very serious',
    (indirectness) => {
      expect(gradeCertainty({ design: 'animal', indirectness }).score).toBe(2);
    },
  );
});

describe('gradeCertainty — downgrades (GRADE Handbook 2013)', () => {
  const domains = ['riskOfBias', 'inconsistency', 'indirectness', 'imprecision', 'publicationBias'] as const;
  it.each(
    domains.flatMap(
      (domain) =>
        [
          [domain, 'serious', -1, 3, 'moderate'],
          [domain, 'very-serious', -2, 2, 'low'],
        ] as const,
    ),
  )('randomized + %s %s → change %i, score %i (%s)', (domain, concern, change, score, level) => {
    const result = gradeCertainty({ design: 'randomized', [domain]: concern } as CertaintyInput);
    expect(result.score).toBe(score);
    expect(result.level).toBe(level);
    expect(result.steps[1]).toMatchObject({ domain, change, score });
  });

  it.each(domains)('a "none" concern on %s adds no step', (domain) => {
    const result = gradeCertainty({ design: 'randomized', [domain]: 'none' } as CertaintyInput);
    expect(result.steps).toHaveLength(1);
    expect(result.score).toBe(4);
  });

  it('adds concerns across domains and lists each as a step, in domain order', () => {
    const result = gradeCertainty({
      design: 'randomized',
      riskOfBias: 'serious',
      imprecision: 'serious',
      publicationBias: 'serious',
    });
    expect(result.score).toBe(1);
    expect(result.level).toBe('very-low');
    expect(result.steps.map((s) => s.domain)).toEqual(['design', 'riskOfBias', 'imprecision', 'publicationBias']);
  });

  it('clamps at 1 and shows the clamp as a step', () => {
    const result = gradeCertainty({ design: 'randomized', riskOfBias: 'very-serious', inconsistency: 'very-serious' });
    expect(result.score).toBe(1);
    expect(result.steps.at(-1)).toMatchObject({ domain: 'clamp', change: 1, score: 1 });
  });

  it('does not show a clamp step when none applied', () => {
    const result = gradeCertainty({ design: 'randomized', riskOfBias: 'very-serious', inconsistency: 'serious' });
    expect(result.score).toBe(1);
    expect(result.steps.some((s) => s.domain === 'clamp')).toBe(false);
  });
});

describe('gradeCertainty — upgrades (GRADE Handbook 2013; Guyatt et al. 2011)', () => {
  it.each([
    [{ largeEffect: 1 }, 3, 'largeEffect', 1],
    [{ largeEffect: 2 }, 4, 'largeEffect', 2],
    [{ doseResponse: true }, 3, 'doseResponse', 1],
    [{ confoundingWouldReduce: true }, 3, 'confoundingWouldReduce', 1],
  ] as const)('cohort + %o → %i', (extra, score, domain, change) => {
    const result = gradeCertainty({ design: 'cohort', ...extra });
    expect(result.score).toBe(score);
    expect(result.steps[1]).toMatchObject({ domain, change, score });
  });

  it('largeEffect 0 and false flags add nothing', () => {
    const result = gradeCertainty({
      design: 'cohort',
      largeEffect: 0,
      doseResponse: false,
      confoundingWouldReduce: false,
    });
    expect(result.score).toBe(2);
    expect(result.steps).toHaveLength(1);
    expect(result.notes).toEqual([]);
  });

  it('case series can be rated up from 1', () => {
    expect(gradeCertainty({ design: 'case-series', largeEffect: 2 }).score).toBe(3);
  });

  it('all upgrades together clamp at 4, with the clamp shown', () => {
    const result = gradeCertainty({
      design: 'cohort',
      largeEffect: 2,
      doseResponse: true,
      confoundingWouldReduce: true,
    });
    expect(result.score).toBe(4);
    expect(result.steps.map((s) => [s.domain, s.change, s.score])).toEqual([
      ['design', 2, 2],
      ['largeEffect', 2, 4],
      ['doseResponse', 1, 5],
      ['confoundingWouldReduce', 1, 6],
      ['clamp', -2, 4],
    ]);
  });

  it('does not rate up evidence that was rated down, and says so in a note', () => {
    const result = gradeCertainty({ design: 'cohort', imprecision: 'serious', largeEffect: 2, doseResponse: true });
    expect(result.score).toBe(1);
    expect(result.steps.map((s) => s.domain)).toEqual(['design', 'imprecision']);
    expect(result.notes).toHaveLength(1);
  });

  it.each(['randomized', 'meta-analysis', 'animal', 'in-vitro'] as const)(
    'does not rate up %s (starts above 2), and says so',
    (design) => {
      const base = gradeCertainty({ design });
      const result = gradeCertainty({ design, largeEffect: 2, doseResponse: true, confoundingWouldReduce: true });
      expect(result.score).toBe(base.score);
      expect(result.steps).toEqual(base.steps);
      expect(result.notes).toHaveLength(1);
    },
  );

  it('lists the running score so the steps add up to the result', () => {
    const result = gradeCertainty({ design: 'randomized', riskOfBias: 'serious', indirectness: 'very-serious' });
    const total = result.steps.reduce((sum, s) => sum + s.change, 0);
    expect(total).toBe(result.score);
    expect(result.steps.at(-1)?.score).toBe(result.score);
    for (const step of result.steps) expect(step.reason.length).toBeGreaterThan(10);
  });
});

describe('largeEffectFromRiskRatio (GRADE: RR > 2 or < 0.5 large; > 5 or < 0.2 very large)', () => {
  it.each([
    [1, 0],
    [2, 0],
    [2.0001, 1],
    [5, 1],
    [5.0001, 2],
    [0.5, 0],
    [0.4999, 1],
    [0.2, 1],
    [0.1999, 2],
    [0.01, 2],
    [100, 2],
  ])('RR %s → %i', (rr, expected) => {
    expect(largeEffectFromRiskRatio(rr)).toBe(expected);
  });

  it.each([[0], [-1], [Number.NaN], [Number.POSITIVE_INFINITY]])('rejects RR %s', (rr) => {
    expect(() => largeEffectFromRiskRatio(rr)).toThrow(ScoringInputError);
  });
});

describe('gradeCertainty — bad input', () => {
  it.each([
    [{ design: 'rct' }, 'design'],
    [{ design: 'randomized', riskOfBias: 'high' }, 'riskOfBias'],
    [{ design: 'randomized', imprecision: 'Serious' }, 'imprecision'],
    [{ design: 'cohort', largeEffect: 3 }, 'largeEffect'],
    [{ design: 'cohort', largeEffect: 1.5 }, 'largeEffect'],
    [{ design: 'cohort', doseResponse: 'yes' }, 'doseResponse'],
    [{ design: 'cohort', confoundingWouldReduce: 1 }, 'confoundingWouldReduce'],
  ])('rejects %o naming the field %s', (input, field) => {
    try {
      gradeCertainty(input as unknown as CertaintyInput);
      expect.unreachable('should have thrown');
    } catch (error) {
      expect(error).toBeInstanceOf(ScoringInputError);
      expect((error as ScoringInputError).field).toBe(field);
    }
  });

  it('rejects a missing input', () => {
    expect(() => gradeCertainty(undefined as unknown as CertaintyInput)).toThrow(ScoringInputError);
  });
});

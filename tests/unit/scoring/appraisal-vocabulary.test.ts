import { describe, expect, it } from 'vitest';
import {
  CERTAINTY_STEP_LABEL,
  CONCERN_INFO,
  CONCERN_LEVELS,
  DOMAIN_INFO,
  DOWNGRADE_DOMAINS,
} from '@/lib/scoring/appraisal-vocabulary';
import { gradeCertainty } from '@/lib/scoring/certainty';
import { appraisalSchema, appraisalUpdateSchema } from '@/lib/validation/appraisals';
import { Appraisal } from '@/models';

// The appraisal's vocabulary has one source; everything that lists the domains must follow it.
describe('the appraisal vocabulary', () => {
  it('holds the five GRADE downgrade domains and three concern levels (GRADE Handbook, 2013)', () => {
    expect(DOWNGRADE_DOMAINS).toEqual(
      expect.arrayContaining(['riskOfBias', 'inconsistency', 'indirectness', 'imprecision', 'publicationBias']),
    );
    for (const domain of DOWNGRADE_DOMAINS) expect(DOMAIN_INFO[domain].help.length).toBeGreaterThan(0);
    expect(CONCERN_LEVELS).toEqual(['none', 'serious', 'very-serious']);
    expect(CONCERN_LEVELS.map((c) => CONCERN_INFO[c].change)).toEqual([0, -1, -2]);
  });

  it('gives the schema, the stored columns and the working one field per domain', () => {
    const attributes = Appraisal.getAttributes();
    for (const domain of DOWNGRADE_DOMAINS) {
      expect(appraisalSchema.shape).toHaveProperty(domain);
      expect(appraisalUpdateSchema.safeParse({ [domain]: 'serious' }).success).toBe(true);
      expect(appraisalUpdateSchema.safeParse({ [domain]: 'awful' }).success).toBe(false);
      expect(attributes[domain]?.defaultValue).toBe('none');
      expect(CERTAINTY_STEP_LABEL[domain]).toBe(DOMAIN_INFO[domain].label);
    }
  });

  it('grades every domain it lists, and words each step with the domain’s label', () => {
    for (const domain of DOWNGRADE_DOMAINS) {
      const result = gradeCertainty({ design: 'randomized', [domain]: 'serious' });
      expect(result.score).toBe(3);
      const step = result.steps.find((s) => s.domain === domain)!;
      expect(step.reason).toContain(DOMAIN_INFO[domain].label.toLowerCase());
    }
  });

  it('fills the schema’s defaults for every domain', () => {
    const parsed = appraisalSchema.parse({ studyId: 1, direction: 'supports' });
    for (const domain of DOWNGRADE_DOMAINS) expect(parsed[domain]).toBe('none');
    expect(parsed.largeEffect).toBe(0);
  });
});

/**
 * The appraisal's vocabulary, in one place: the GRADE domains that rate certainty down, their
 * concern levels, the three reasons to rate up, and the words people read for each. The form,
 * the validation schema, the stored columns, the certainty working, the scorecard and the tables
 * all derive from these tables, so adding a domain means a row here and a column in a migration
 * (docs/scoring.md §1).
 *
 * Domain names and levels: GRADE Handbook (Schünemann et al., eds., 2013); Guyatt et al. 2011,
 * J Clin Epidemiol 64 (the GRADE guidelines series). The help texts are ours.
 *
 * @example
 * import { DOWNGRADE_DOMAINS, DOMAIN_INFO } from '@/lib/scoring/appraisal-vocabulary';
 * DOMAIN_INFO.riskOfBias.label; // 'Risk of bias'
 *
 * @module
 */

/**
 * The five domains that can rate certainty down, in the order the form lists them, each with
 * its label and a one-line hint of what to look for.
 *
 * @example
 * Object.keys(DOMAIN_INFO).length; // 5
 */
export const DOMAIN_INFO = {
  riskOfBias: { label: 'Risk of bias', help: 'Randomisation, blinding, drop-outs, selective reporting.' },
  inconsistency: { label: 'Inconsistency', help: 'Results that disagree across groups or studies.' },
  indirectness: { label: 'Indirectness', help: 'Different people, exercise, dose or outcome from the claim’s.' },
  imprecision: { label: 'Imprecision', help: 'Few participants, wide confidence interval.' },
  publicationBias: { label: 'Publication bias', help: 'Signs that null results went unpublished.' },
} as const satisfies Record<string, { label: string; help: string }>;

/**
 * One downgrade domain's key, as stored and sent.
 *
 * @example
 * const domain: DowngradeDomain = 'imprecision';
 */
export type DowngradeDomain = keyof typeof DOMAIN_INFO;

/**
 * The domain keys, in form order.
 *
 * @example
 * DOWNGRADE_DOMAINS[0]; // 'riskOfBias'
 */
export const DOWNGRADE_DOMAINS = Object.keys(DOMAIN_INFO) as readonly DowngradeDomain[];

/**
 * Concern levels of a domain, how far each rates certainty down, and the label a person reads.
 * Source: GRADE Handbook (2013) — "serious" one level, "very serious" two.
 *
 * @example
 * CONCERN_INFO['very-serious'].change; // -2
 */
export const CONCERN_INFO = {
  none: { change: 0, label: 'No concern' },
  serious: { change: -1, label: 'Serious (−1)' },
  'very-serious': { change: -2, label: 'Very serious (−2)' },
} as const satisfies Record<string, { change: number; label: string }>;

/**
 * A concern level's key.
 *
 * @example
 * const concern: ConcernLevel = 'serious';
 */
export type ConcernLevel = keyof typeof CONCERN_INFO;

/**
 * The concern levels, mildest first, as a tuple (zod's enum wants one).
 *
 * @example
 * CONCERN_LEVELS; // ['none', 'serious', 'very-serious']
 */
export const CONCERN_LEVELS = Object.keys(CONCERN_INFO) as [ConcernLevel, ...ConcernLevel[]];

/**
 * The three reasons to rate up, with the label the certainty working shows.
 * Source: GRADE Handbook (2013) — large effect, dose-response gradient, plausible confounding.
 *
 * @example
 * UPGRADE_INFO.doseResponse.label; // 'Dose–response'
 */
export const UPGRADE_INFO = {
  largeEffect: { label: 'Large effect' },
  doseResponse: { label: 'Dose–response' },
  confoundingWouldReduce: { label: 'Confounding' },
} as const;

/**
 * The label of each kind of step in the certainty working: the design's start, the domains, the
 * upgrades, and the final hold to 1…4.
 *
 * @example
 * CERTAINTY_STEP_LABEL.clamp; // 'Limit'
 */
export const CERTAINTY_STEP_LABEL = {
  design: 'Start',
  ...perDomain((d) => DOMAIN_INFO[d].label as string),
  largeEffect: UPGRADE_INFO.largeEffect.label,
  doseResponse: UPGRADE_INFO.doseResponse.label,
  confoundingWouldReduce: UPGRADE_INFO.confoundingWouldReduce.label,
  clamp: 'Limit',
};

/**
 * The large-effect choices, 0 none … 2 very large, with the words the form offers.
 * Source: GRADE Handbook (2013) — RR > 2 or < 0.5 large, RR > 5 or < 0.2 very large.
 *
 * @example
 * LARGE_EFFECT_INFO[1].label; // 'Large: risk ratio above 2 or below 0.5 (+1)'
 */
export const LARGE_EFFECT_INFO = {
  0: { label: 'No' },
  1: { label: 'Large: risk ratio above 2 or below 0.5 (+1)' },
  2: { label: 'Very large: above 5 or below 0.2 (+2)' },
} as const;

/**
 * A large-effect grade.
 *
 * @example
 * const grade: LargeEffect = 2;
 */
export type LargeEffect = keyof typeof LARGE_EFFECT_INFO;

/**
 * The large-effect grades, as numbers.
 *
 * @example
 * LARGE_EFFECTS; // [0, 1, 2]
 */
export const LARGE_EFFECTS = Object.keys(LARGE_EFFECT_INFO).map(Number) as LargeEffect[];

/**
 * A value for every domain, built by `make` — for the stored columns, the schema's fields, a
 * form's defaults.
 *
 * @example
 * perDomain(() => 'none'); // { riskOfBias: 'none', inconsistency: 'none', … }
 */
export function perDomain<T>(make: (domain: DowngradeDomain) => T): Record<DowngradeDomain, T> {
  return Object.fromEntries(DOWNGRADE_DOMAINS.map((d) => [d, make(d)])) as Record<DowngradeDomain, T>;
}

/**
 * Only the domain fields of a row, DTO or draft (a copy).
 *
 * @example
 * pickDomains({ riskOfBias: 'serious', notes: '…', ... }); // { riskOfBias: 'serious', … }
 */
export function pickDomains<T>(source: Record<DowngradeDomain, T>): Record<DowngradeDomain, T> {
  return perDomain((d) => source[d]);
}

/**
 * What the coach grades one study with, besides its design: the five domains and the three
 * reasons to rate up.
 *
 * @example
 * const g: GradingFields = { ...perDomain(() => 'none'), largeEffect: 0, doseResponse: false, confoundingWouldReduce: false };
 */
export type GradingFields = Record<DowngradeDomain, ConcernLevel> & {
  largeEffect: LargeEffect;
  doseResponse: boolean;
  confoundingWouldReduce: boolean;
};

/**
 * Only the grading fields of a row, DTO or draft — what the certainty grading reads.
 *
 * @example
 * gradeCertainty({ design: 'cohort', ...gradingFields(appraisal) });
 */
export function gradingFields(source: GradingFields): GradingFields {
  return {
    ...pickDomains(source),
    largeEffect: source.largeEffect,
    doseResponse: source.doseResponse,
    confoundingWouldReduce: source.confoundingWouldReduce,
  };
}

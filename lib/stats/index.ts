/**
 * Statistics for the evidence library and peer review: effect sizes, meta-analysis and
 * agreement between reviewers. Distributions come from jstat.
 *
 * @example
 * import { metaAnalysis, logRiskRatio, krippendorffAlpha } from '@/lib/stats';
 *
 * @module
 */
export * from './agreement';
export * from './distributions';
export * from './effect-size';
export * from './meta-analysis';

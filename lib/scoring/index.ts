/**
 * The scoring model: certainty, applicability, mechanism probabilities, likelihood words and the
 * verdict. Pure functions of plain data; nothing here loads or saves anything.
 *
 * @example
 * import { scoreReview, gradeCertainty, likelihoodTerm } from '@/lib/scoring';
 *
 * @module
 */
export * from './applicability';
export * from './certainty';
export * from './constants';
export * from './errors';
export * from './format';
export * from './likelihood';
export {
  appraisalLogOdds,
  logistic,
  logit,
  scoreMechanism,
  type MechanismInput,
  type MechanismScore,
} from './mechanism';
export * from './robustness';
export * from './types';
export * from './verdict';
export * from './direction';

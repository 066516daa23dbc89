import { DOSE_MATCH_FLOOR, INJURY_EXTRA_LEVELS, POPULATION_MATCH_BY_DISTANCE, TRAINING_STATUSES } from './constants';
import { formatNumber } from './format';
import { optionalBoolean, requireFraction, requireObject, requireOneOf } from './validate';
import type { TrainingStatus } from './types';

/**
 * What the app knows about a study and about the protocol under review. Every field is
 * optional: unknowns count as a match rather than a mismatch, because the coach can still lower
 * applicability by hand with a reason.
 *
 * @example
 * const input: ApplicabilityInput = {
 *   studyPopulation: 'untrained', targetPopulation: 'trained',
 *   studyIntensity: 0.6, protocolIntensity: 0.8,
 * };
 */
export interface ApplicabilityInput {
  studyPopulation?: TrainingStatus;
  targetPopulation?: TrainingStatus;
  /** Unset means healthy. */
  studyInjured?: boolean;
  /** Unset means healthy. */
  targetInjured?: boolean;
  /** Fraction of maximum, 0…1. */
  studyIntensity?: number;
  /** Fraction of maximum, 0…1. */
  protocolIntensity?: number;
}

/**
 * A suggested applicability with the two factors behind it and a sentence for each, for the
 * appraisal form's "suggested applicability with its reasons".
 *
 * @example
 * const explained: ApplicabilityExplanation = {
 *   applicability: 0.5625, populationMatch: 0.75, doseMatch: 0.75,
 *   populationReason: '…', doseReason: '…', text: '…',
 * };
 */
export interface ApplicabilityExplanation {
  applicability: number;
  populationMatch: number;
  doseMatch: number;
  populationReason: string;
  doseReason: string;
  /** Both reasons and the product, in one paragraph. */
  text: string;
}

const healthWord = (injured: boolean): string => (injured ? 'injured' : 'healthy');
const article = (word: string): string => `${/^[aeiou]/.test(word) ? 'an' : 'a'} ${word}`;

/**
 * Applicability = populationMatch × doseMatch, with the reasons (docs/scoring.md §2 and its precise
 * rules).
 *
 * - populationMatch: levels apart on untrained < recreational < trained < elite, plus one level
 *   when one side is injured and the other healthy; 1.0 same, 0.75 one apart, 0.5 further. An
 *   unknown population on either side gives 1.0.
 * - doseMatch = max(0.1, 1 − |I_study − I_protocol| / max(I_study, I_protocol)); 1.0 when either
 *   intensity is unknown or both are 0.
 *
 * @example
 * explainApplicability({ studyPopulation: 'recreational', targetPopulation: 'trained',
 *   studyIntensity: 0.4, protocolIntensity: 0.8 });
 * // { applicability: 0.375, populationMatch: 0.75, doseMatch: 0.5, ... }
 */
export function explainApplicability(input: ApplicabilityInput = {}): ApplicabilityExplanation {
  const raw = requireObject('applicability input', input);
  const studyPopulation =
    raw.studyPopulation === undefined
      ? undefined
      : requireOneOf('studyPopulation', raw.studyPopulation, TRAINING_STATUSES);
  const targetPopulation =
    raw.targetPopulation === undefined
      ? undefined
      : requireOneOf('targetPopulation', raw.targetPopulation, TRAINING_STATUSES);
  const studyInjured = optionalBoolean('studyInjured', raw.studyInjured) ?? false;
  const targetInjured = optionalBoolean('targetInjured', raw.targetInjured) ?? false;
  const studyIntensity =
    raw.studyIntensity === undefined ? undefined : requireFraction('studyIntensity', raw.studyIntensity);
  const protocolIntensity =
    raw.protocolIntensity === undefined ? undefined : requireFraction('protocolIntensity', raw.protocolIntensity);

  let populationMatch: number;
  let populationReason: string;
  if (studyPopulation === undefined || targetPopulation === undefined) {
    populationMatch = 1;
    populationReason =
      'Population match 1: the training status of the study or of the target population is not recorded.';
  } else {
    const statusGap = Math.abs(
      TRAINING_STATUSES.indexOf(studyPopulation) - TRAINING_STATUSES.indexOf(targetPopulation),
    );
    const injuryGap = studyInjured === targetInjured ? 0 : INJURY_EXTRA_LEVELS;
    const distance = statusGap + injuryGap;
    populationMatch = POPULATION_MATCH_BY_DISTANCE[Math.min(distance, POPULATION_MATCH_BY_DISTANCE.length - 1)];
    populationReason =
      `Population match ${formatNumber(populationMatch)}: ${article(healthWord(studyInjured))} ${studyPopulation} ` +
      `sample for ${article(healthWord(targetInjured))} ${targetPopulation} population is ` +
      (distance === 0
        ? 'the same level'
        : `${distance} level${distance === 1 ? '' : 's'} apart` +
          (injuryGap > 0 ? ` (${statusGap} in training status, 1 for injured vs healthy)` : '')) +
      '.';
  }

  let doseMatch: number;
  let doseReason: string;
  if (studyIntensity === undefined || protocolIntensity === undefined) {
    doseMatch = 1;
    doseReason = 'Dose match 1: the intensity of the study or of the protocol is not recorded.';
  } else if (studyIntensity === 0 && protocolIntensity === 0) {
    doseMatch = 1;
    doseReason = 'Dose match 1: study and protocol both train at zero intensity.';
  } else {
    const gap = Math.abs(studyIntensity - protocolIntensity);
    const larger = Math.max(studyIntensity, protocolIntensity);
    const unfloored = 1 - gap / larger;
    doseMatch = Math.max(DOSE_MATCH_FLOOR, unfloored);
    doseReason =
      `Dose match ${formatNumber(doseMatch)}: 1 − |${formatNumber(studyIntensity)} − ` +
      `${formatNumber(protocolIntensity)}| / ${formatNumber(larger)} = ${formatNumber(unfloored)}` +
      (unfloored < DOSE_MATCH_FLOOR ? `, raised to the floor of ${formatNumber(DOSE_MATCH_FLOOR)}` : '') +
      ' (intensities as a fraction of maximum).';
  }

  const applicability = populationMatch * doseMatch;
  return {
    applicability,
    populationMatch,
    doseMatch,
    populationReason,
    doseReason,
    text:
      `${populationReason} ${doseReason} Suggested applicability ${formatNumber(populationMatch)} × ` +
      `${formatNumber(doseMatch)} = ${formatNumber(applicability)}.`,
  };
}

/**
 * The suggested applicability alone (0…1); see {@link explainApplicability} for the reasons.
 *
 * @example
 * suggestApplicability({ studyPopulation: 'elite', targetPopulation: 'elite' }); // 1
 * suggestApplicability({ studyPopulation: 'untrained', targetPopulation: 'elite' }); // 0.5
 * suggestApplicability({ studyIntensity: 0.3, protocolIntensity: 0.6 }); // 0.5
 */
export function suggestApplicability(input: ApplicabilityInput = {}): number {
  return explainApplicability(input).applicability;
}

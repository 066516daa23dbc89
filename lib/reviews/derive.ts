import {
  appraisalLogOdds,
  explainApplicability,
  gradeCertainty,
  type ApplicabilityExplanation,
  type CertaintyResult,
} from '@/lib/scoring';
import { gradingFields, type GradingFields } from '@/lib/scoring/appraisal-vocabulary';
import type { Direction, StudyDesign, TrainingStatus } from './types';

/**
 * What the scoring engine derives for one appraisal — certainty from the study's design and the
 * coach's five domains, suggested applicability from population and dose match — computed on
 * every read from plain data, never stored, so a change to a study shows up everywhere at once.
 */

export interface StudyFacts {
  design: StudyDesign | null;
  population: TrainingStatus | null;
  injured: boolean;
  intensity: number | null;
}

export interface TargetFacts {
  status: TrainingStatus | null;
  injured: boolean;
  /** The protocol's intensity, fraction of maximum. */
  intensity: number | null;
}

export type AppraisalFacts = GradingFields & {
  direction: Direction;
  applicabilityOverride: number | null;
};

export interface DerivedAppraisal {
  certainty: CertaintyResult;
  suggestion: ApplicabilityExplanation;
  applicability: number;
  overridden: boolean;
  logOddsTerm: number;
}

/**
 * A study must have its design recorded before it can be appraised (lib/reviews/commands.ts
 * refuses otherwise), since GRADE starts from the design. Rows from before that rule, or edited
 * outside the app, are graded from the lowest starting design and say so, rather than failing.
 */
const FALLBACK_DESIGN: StudyDesign = 'expert-opinion';

export function deriveAppraisal(appraisal: AppraisalFacts, study: StudyFacts, target: TargetFacts): DerivedAppraisal {
  const certainty = gradeCertainty({
    design: study.design ?? FALLBACK_DESIGN,
    ...gradingFields(appraisal),
  });
  if (study.design === null) {
    certainty.notes.unshift(
      'The study’s design is not recorded in the library, so it is graded from the lowest start (expert opinion) until it is.',
    );
  }
  const suggestion = explainApplicability({
    studyPopulation: study.population ?? undefined,
    targetPopulation: target.status ?? undefined,
    studyInjured: study.injured,
    targetInjured: target.injured,
    studyIntensity: study.intensity ?? undefined,
    protocolIntensity: target.intensity ?? undefined,
  });
  const overridden = appraisal.applicabilityOverride !== null;
  const applicability = overridden ? appraisal.applicabilityOverride! : suggestion.applicability;
  const logOddsTerm = appraisalLogOdds({ direction: appraisal.direction, certainty: certainty.level, applicability });
  return { certainty, suggestion, applicability, overridden, logOddsTerm };
}

import type { Appraisal, Mechanism, Review } from '@/models';
import { pickDomains, type DowngradeDomain, type LargeEffect } from '@/lib/scoring/appraisal-vocabulary';
import { protocolIntensity } from './protocol';
import type {
  AppraisalDTO,
  Concern,
  Direction,
  Effort,
  Magnitude,
  MechanismDTO,
  MechanismKind,
  PopulationDTO,
  ProtocolDTO,
  RecommendationsDTO,
  ReviewDTO,
  ReviewStatus,
  ReviewSummaryDTO,
  TrainingStatus,
  VerdictKey,
} from './types';
import type { AppraisalFacts, DerivedAppraisal, TargetFacts } from './derive';
import type { AppraisalRowFacts, ReviewFacts } from './verdict';
import { VERDICT_LABEL } from '@/lib/scoring/constants';
import type { Desirable } from '@/lib/scoring/direction';

/**
 * Model rows → the DTOs of ./types.ts. The models keep enumerations as plain strings (models
 * never import lib/); every value was validated by zod on the way in, so the casts here narrow
 * what is already known to be valid.
 */

const PROTOCOL_KEYS = [
  'exercise',
  'loadValue',
  'loadUnit',
  'referenceBodyweightKg',
  'referenceMaxAddedKg',
  'secondsPerSet',
  'setsPerSession',
  'sessionsPerDay',
  'daysPerWeek',
  'minHoursBetween',
  'weeks',
  'effort',
] as const;

/** The stored protocol with its derived intensity. */
export function toProtocolDTO(stored: Record<string, unknown>): ProtocolDTO {
  const protocol = {} as Record<string, unknown>;
  for (const key of PROTOCOL_KEYS) protocol[key] = stored[key] ?? (key === 'exercise' ? '' : null);
  const typed = protocol as Omit<ProtocolDTO, 'intensity'>;
  return { ...typed, intensity: protocolIntensity(typed) };
}

export function toPopulationDTO(review: Review): PopulationDTO {
  return { status: review.populationStatus as TrainingStatus | null, injured: review.populationInjured };
}

export function targetFacts(
  review: Pick<ReviewFacts, 'protocol' | 'populationStatus' | 'populationInjured'>,
): TargetFacts {
  return {
    status: review.populationStatus as TrainingStatus | null,
    injured: review.populationInjured,
    intensity: toProtocolDTO(review.protocol).intensity,
  };
}

export function toSummaryDTO(review: Review, authorName: string): ReviewSummaryDTO {
  const verdict = review.verdict as VerdictKey | null;
  return {
    id: review.id,
    teamId: review.teamId,
    title: review.title,
    slug: review.slug,
    claim: review.claim,
    status: review.status as ReviewStatus,
    verdict,
    verdictLabel: verdict ? VERDICT_LABEL[verdict] : null,
    tags: review.tags ?? [],
    authorId: review.authorId,
    authorName,
    updatedAt: review.updatedAt.toISOString(),
  };
}

export function toReviewDTO(review: Review, authorName: string): ReviewDTO {
  const recommendations = (review.recommendations ?? {}) as Partial<RecommendationsDTO>;
  return {
    ...toSummaryDTO(review, authorName),
    claimSource: review.claimSource,
    claimUrl: review.claimUrl,
    protocol: toProtocolDTO(review.protocol),
    population: toPopulationDTO(review),
    body: review.body,
    recommendations: {
      whoMightTry: recommendations.whoMightTry ?? '',
      whoShouldNot: recommendations.whoShouldNot ?? '',
      whatInstead: recommendations.whatInstead ?? '',
    },
    outcomeDesirable: review.outcomeDesirable as Desirable,
    version: review.version,
    createdAt: review.createdAt.toISOString(),
  };
}

export function toMechanismDTO(m: Mechanism): MechanismDTO {
  return {
    id: m.id,
    reviewId: m.reviewId,
    name: m.name,
    kind: m.kind as MechanismKind,
    summary: m.summary,
    minIntensity: m.minIntensity,
    minEffort: m.minEffort as Effort | null,
    prior: m.prior,
    magnitude: m.magnitude as Magnitude,
    stated: m.stated,
    desirable: m.desirable as Desirable,
    position: m.position,
  };
}

export function appraisalFacts(a: AppraisalRowFacts): AppraisalFacts {
  return {
    direction: a.direction as Direction,
    ...(pickDomains(a) as Record<DowngradeDomain, Concern>),
    largeEffect: a.largeEffect as LargeEffect,
    doseResponse: a.doseResponse,
    confoundingWouldReduce: a.confoundingWouldReduce,
    applicabilityOverride: a.applicabilityOverride,
  };
}

export function toAppraisalDTO(a: Appraisal, derived: DerivedAppraisal): AppraisalDTO {
  return {
    id: a.id,
    reviewId: a.reviewId,
    studyId: a.studyId,
    mechanismId: a.mechanismId,
    ...appraisalFacts(a),
    overrideReason: a.overrideReason,
    directionReason: a.directionReason ?? null,
    needsCheck: a.needsCheck,
    notes: a.notes,
    certainty: derived.certainty.level,
    suggestedApplicability: derived.suggestion.applicability,
    applicability: derived.applicability,
  };
}

import type { PopulationDTO, ProtocolDTO } from '@/lib/reviews/types';
import type { DowngradeDomain } from '@/lib/scoring/appraisal-vocabulary';

/**
 * The shapes the peer-review routes send and the round pages read. Importable by client
 * components (no server code here). Bands are the likelihood bands 0…6 of docs/scoring.md §4/§7.
 */

export const ROUND_STATUSES = ['open', 'closed'] as const;
export type RoundStatus = (typeof ROUND_STATUSES)[number];

export const CONTRIBUTIONS = ['none', 'small', 'moderate', 'large'] as const;
export type Contribution = (typeof CONTRIBUTIONS)[number];

export const SIGN_OFFS = ['approve', 'approve-with-changes', 'do-not-publish'] as const;
export type SignOff = (typeof SIGN_OFFS)[number];

/** What the author did about a flagged mechanism. Changes are made in the workbench once the round closes (the review is frozen while it is open). */
export const RESOLUTION_KINDS = ['change-prior', 'change-appraisals', 'change-magnitude', 'keep'] as const;
export type ResolutionKind = (typeof RESOLUTION_KINDS)[number];

export interface RatingDTO {
  mechanismId: number;
  /** Likelihood band 0 (exceptionally unlikely) … 6 (virtually certain); null while undecided. */
  band: number | null;
  contribution: Contribution | null;
  comment: string;
}

export interface ScorecardDTO {
  roundId: number;
  reviewerId: number;
  ratings: RatingDTO[];
  overallComment: string;
  signOff: SignOff | null;
  submittedAt: string | null;
  updatedAt: string | null;
}

export interface InvitationDTO {
  reviewerId: number;
  reviewerName: string;
  invitedAt: string;
  submittedAt: string | null;
  closedWithoutReason: string | null;
  remindedAt: string | null;
}

export interface ResolutionDTO {
  mechanismId: number;
  kind: ResolutionKind;
  reason: string;
  byId: number;
  byName: string;
  at: string;
}

export interface RoundDTO {
  id: number;
  reviewId: number;
  status: RoundStatus;
  openedById: number | null;
  openedByName: string;
  openedAt: string;
  dueAt: string;
  closedAt: string | null;
  /** The review status the close led to. */
  outcome: 'approved' | 'draft' | null;
  note: string;
  /** Author and owner see every invitation; an invited reviewer sees only their own. */
  invitations: InvitationDTO[];
  /** Author and owner only. */
  resolutions: ResolutionDTO[];
  /** Facts about the caller, so pages know what to offer. */
  you: { invited: boolean; submitted: boolean; manages: boolean };
}

/** A mechanism as a reviewer sees it: the coach's inputs, never the engine's outputs. */
export interface BlindMechanismDTO {
  id: number;
  name: string;
  kind: string;
  summary: string;
  minIntensity: number | null;
  minEffort: string | null;
  prior: number;
  magnitude: string;
  stated: boolean;
  position: number;
}

export interface BlindStudyDTO {
  id: number;
  citation: string;
  title: string;
  year: number | null;
  journal: string | null;
  design: string | null;
  population: string | null;
  n: number | null;
  intensity: number | null;
  durationWeeks: number | null;
  outcome: string | null;
}

/** An appraisal as entered by the author (direction and GRADE domains), without derived scores. */
export interface BlindAppraisalDTO extends Record<DowngradeDomain, string> {
  id: number;
  studyId: number;
  mechanismId: number | null;
  direction: string;
  notes: string;
  /** Why the direction differs from the one the study's effect suggests (docs/scoring.md §10). */
  directionReason: string | null;
}

/** GET /api/reviews/:id/rounds/:roundId/scorecard — everything the reviewer scores from, blind. */
export interface ScorecardViewDTO {
  round: RoundDTO;
  review: {
    id: number;
    teamId: number;
    title: string;
    claim: string;
    claimSource: string;
    claimUrl: string | null;
    authorName: string;
    protocol: ProtocolDTO;
    population: PopulationDTO;
    body: Record<string, unknown>;
  };
  mechanisms: BlindMechanismDTO[];
  studies: BlindStudyDTO[];
  appraisals: BlindAppraisalDTO[];
  scorecard: ScorecardDTO;
}

export interface MechanismAgreementDTO {
  mechanismId: number;
  name: string;
  position: number;
  ratings: {
    reviewerId: number;
    reviewerName: string;
    band: number;
    contribution: Contribution | null;
    comment: string;
  }[];
  min: number | null;
  max: number | null;
  span: number | null;
  flagged: boolean;
  /** The engine's band for this mechanism now (not counted in α). */
  engineBand: number;
  engineProbability: number;
  resolution: ResolutionDTO | null;
}

/** GET /api/reviews/:id/rounds/:roundId/agreement */
export interface AgreementDTO {
  roundId: number;
  status: RoundStatus;
  /** Submitted scorecards counted. */
  raters: number;
  alpha: {
    ordinal: number | null;
    nominal: number | null;
    interval: number | null;
    interpretation: 'reliable' | 'tentative' | 'unreliable' | null;
    /** Why α is absent, when it is. */
    missing: string | null;
  };
  /** Two reviewers only. */
  kappa: {
    linear: number;
    quadratic: number;
    interpretation: string;
  } | null;
  /** Flagged (span ≥ 2 bands) first, then by span, then in the review's order. */
  mechanisms: MechanismAgreementDTO[];
  flaggedCount: number;
  unresolvedFlags: number;
  signOffs: { reviewerId: number; reviewerName: string; signOff: SignOff | null; overallComment: string }[];
  /** What still stops the round from closing, in sentences (empty: it can close). */
  blockers: string[];
}

export interface CommentDTO {
  id: number;
  reviewId: number;
  roundId: number | null;
  mechanismId: number | null;
  authorId: number | null;
  authorName: string;
  parentId: number | null;
  body: string;
  resolved: boolean;
  resolvedByName: string | null;
  resolvedAt: string | null;
  createdAt: string;
}

export interface RoundAuditDTO {
  id: number;
  action: string;
  actorName: string;
  at: string;
  data: Record<string, unknown> | null;
}

/** People the author may invite: the team's coaches and reviewers, not the author. */
export interface CandidateDTO {
  userId: number;
  name: string;
  email: string;
  role: 'coach' | 'reviewer';
}

export const SIGN_OFF_LABEL: Record<SignOff, string> = {
  approve: 'Approve',
  'approve-with-changes': 'Approve with changes',
  'do-not-publish': 'Do not publish',
};

export const CONTRIBUTION_LABEL: Record<Contribution, string> = {
  none: 'None',
  small: 'Small',
  moderate: 'Moderate',
  large: 'Large',
};

export const RESOLUTION_LABEL: Record<ResolutionKind, string> = {
  'change-prior': 'Change the prior',
  'change-appraisals': 'Change the appraisals',
  'change-magnitude': 'Change the magnitude',
  keep: 'Keep as it is',
};

/** A scorecard this person still owes: an open round they were invited to and have not submitted. */
export interface PendingScorecardDTO {
  reviewId: number;
  roundId: number;
  title: string;
  dueAt: string;
  overdue: boolean;
  draftSaved: boolean;
}

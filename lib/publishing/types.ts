import type {
  Effort,
  MechanismKind,
  PopulationDTO,
  ProtocolDTO,
  RecommendationsDTO,
  VerdictKey,
} from '@/lib/reviews/types';
import type { NoticeKind } from '@/lib/watch/notices';

/**
 * What a published version holds (stored as JSON, never changed) and what the pages and routes
 * of publishing send. The snapshot is self-contained: the verdict page renders it without
 * reading the review, its mechanisms or the library.
 */

export type Visibility = 'team' | 'public';

export interface SnapshotMechanism {
  id: number;
  name: string;
  kind: MechanismKind;
  summary: string;
  stated: boolean;
  rank: number;
  probability: number;
  term: string;
  /** Fraction 0…1 of the summed expected contributions. */
  share: number;
  dosePenalty: number;
}

export interface SnapshotReference {
  studyId: number;
  /** Author–year, as the body's inline citations show it. */
  citation: string;
  apa: string;
  /** Sanitized APA HTML (italics). */
  apaHtml: string;
  doi: string | null;
  bibtex: string;
  ris: string;
}

/** The protocol in everyday words (lib/publishing/plain.ts). */
export interface EverydayProtocol {
  lines: string[];
  /** What the load is for a few body weights, when the load is body-weight based. */
  loadTable: { bodyweightKg: number; totalKg: number; addedKg: number }[] | null;
  loadTableNote: string | null;
}

/** What the verdict rests on and what would change it, in words for athletes (docs/scoring.md §9). */
export interface SnapshotRobustness {
  /** "This verdict rests on …" */
  restsOn: string;
  /** "It would change if …" */
  wouldChange: string;
  fragility: 1 | 2 | null;
  pivotal: { studyId: number; citation: string }[];
}

export interface VersionSnapshot {
  schema: 1;
  title: string;
  claim: string;
  claimSource: string;
  claimUrl: string | null;
  tags: string[];
  protocol: ProtocolDTO;
  everyday: EverydayProtocol;
  population: PopulationDTO;
  verdict: {
    key: VerdictKey;
    label: string;
    outcomeProbability: number;
    outcomeTerm: string;
    summary: string;
  };
  mechanisms: SnapshotMechanism[];
  recommendations: RecommendationsDTO;
  bodyHtml: string;
  /** The body's words, for search. */
  bodyText: string;
  references: SnapshotReference[];
  team: { id: number; name: string; slug: string };
  authors: string[];
  effort: Effort | null;
  /** Absent from versions published before verdicts said how firm they are. */
  robustness?: SnapshotRobustness;
}

export interface VersionSummaryDTO {
  number: number;
  publishedAt: string;
  publishedBy: string;
  changeNote: string | null;
}

/** GET /api/verdicts and the athlete's home: one line per publication. */
export interface VerdictListItemDTO {
  slug: string;
  teamId: number;
  teamName: string;
  title: string;
  claim: string;
  verdict: VerdictKey;
  verdictLabel: string;
  visibility: Visibility;
  version: number;
  publishedAt: string;
  withdrawn: boolean;
  /** Search only: matched ranges per field, for highlighting. */
  matches?: MatchDTO[];
  score?: number;
}

export interface MatchDTO {
  key: string;
  value: string;
  indices: [number, number][];
}

/** The verdict page's data: the publication, the version shown, and every version's summary. */
export interface VerdictPageDTO {
  slug: string;
  reviewId: number;
  teamId: number;
  visibility: Visibility;
  withdrawn: { at: string; reason: string } | null;
  version: VersionSummaryDTO;
  latestNumber: number;
  versions: VersionSummaryDTO[];
  snapshot: VersionSnapshot;
  /**
   * Studies this version cites that received a notice since it was published (lib/watch): the
   * page says so above the verdict. Empty (or absent) on earlier versions and once a new version is out.
   */
  evidenceChanged?: EvidenceChangedDTO[];
}

export interface EvidenceChangedDTO {
  citation: string;
  kind: NoticeKind;
  noticeDoi: string;
  date: string | null;
}

export interface PublishResultDTO {
  slug: string;
  url: string;
  version: VersionSummaryDTO;
  visibility: Visibility;
  notified: number;
}

/**
 * The swr cache keys, one function per resource, so a mutation and the hooks that read agree
 * on the exact URL (a typo here would mean a panel that never refreshes).
 */
import { query } from './fetcher';

export type MetaAnalysisTarget = number | 'outcome';

export interface StudyQuery {
  teamId: number;
  q?: string;
  design?: string;
  tag?: string;
  sort?: string;
  page?: number;
  pageSize?: number;
}

export const keys = {
  reviews: (teamId: number, filters: { status?: string; verdict?: string; tag?: string } = {}) =>
    `/api/reviews${query({ teamId, ...filters })}`,
  workbench: (reviewId: number) => `/api/reviews/${reviewId}`,
  verdict: (reviewId: number) => `/api/reviews/${reviewId}/verdict`,
  metaAnalysis: (reviewId: number, target: MetaAnalysisTarget) =>
    `/api/reviews/${reviewId}/meta-analysis${query({ mechanism: target })}`,
  studies: (q: StudyQuery) =>
    `/api/studies${query({ teamId: q.teamId, q: q.q, design: q.design, tag: q.tag, sort: q.sort, page: q.page, pageSize: q.pageSize })}`,
  study: (studyId: number) => `/api/studies/${studyId}`,
  citation: (studyId: number, format: 'apa' | 'bibtex' | 'ris' | 'csl') =>
    `/api/studies/${studyId}/citation${query({ format })}`,
  studyFile: (studyId: number) => `/api/studies/${studyId}/file`,
  search: (params: URLSearchParams) => `/api/search?${params}`,
  verdictSearch: (q: string, teamId?: number) => `/api/verdicts${query({ q, teamId })}`,
  publication: (reviewId: number) => `/api/reviews/${reviewId}/publish`,
};

/** Every cached read that belongs to one review (workbench, verdict, meta-analyses). */
export const isReviewKey = (reviewId: number) => (key: unknown) =>
  typeof key === 'string' && (key === keys.workbench(reviewId) || key.startsWith(`${keys.workbench(reviewId)}/`));

/** Every cached page of a team's library, whatever its filters. */
export const isStudiesKey = (key: unknown) => typeof key === 'string' && key.startsWith('/api/studies');

/** Every cached list of reviews. */
export const isReviewListKey = (key: unknown) => typeof key === 'string' && key.startsWith('/api/reviews?');

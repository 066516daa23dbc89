import type { MatchDTO } from '@/lib/publishing/types';
import { FuzzyIndex, type FieldSpec } from './engine';

/**
 * The documents the workbench search covers and the fuse.js options they are searched with.
 * Pure (no database): lib/search/index-store.ts fills and updates the indexes, bench/search.ts
 * times the same code over generated data, and the fixture test ranks a known set. The fuzzy
 * matching (fuse.js over the vocabulary) and the ranking are in ./engine.ts.
 */

export interface ReviewDoc {
  kind: 'review';
  key: string;
  id: number;
  teamId: number;
  reviewId: number;
  title: string;
  claim: string;
  tags: string[];
  mechanisms: string[];
  body: string;
  status: string;
  verdict: string | null;
  slug: string;
}
export interface MechanismDoc {
  kind: 'mechanism';
  key: string;
  id: number;
  teamId: number;
  reviewId: number;
  reviewTitle: string;
  name: string;
  summary: string;
}
export interface StudyDoc {
  kind: 'study';
  key: string;
  id: number;
  teamId: number;
  title: string;
  citation: string;
  journal: string;
  doi: string;
  tags: string[];
}
export type SearchDoc = ReviewDoc | MechanismDoc | StudyDoc;

/** Long bodies are cut: the first words carry the analysis' vocabulary, and memory grows with text. */
export const BODY_CHARS = 4000;

const str = (v: unknown): string | string[] => (Array.isArray(v) ? (v as string[]) : typeof v === 'string' ? v : '');
const field = (name: string, weight: number): FieldSpec<SearchDoc> => ({
  name,
  weight,
  get: (doc) => str((doc as unknown as Record<string, unknown>)[name]),
});

/** The fields searched and their weights: what a review is called and claims weighs most, its body least. */
export const FIELDS: FieldSpec<SearchDoc>[] = [
  field('title', 3),
  field('claim', 3),
  field('name', 3),
  field('tags', 2),
  field('mechanisms', 2),
  field('citation', 1.5),
  field('summary', 1),
  field('reviewTitle', 0.5),
  field('journal', 0.5),
  field('doi', 0.5),
  field('body', 0.5),
];

export function newIndex(docs: SearchDoc[]): FuzzyIndex<SearchDoc> {
  return new FuzzyIndex<SearchDoc>(FIELDS, (d) => d.key, docs);
}

export interface SearchFilters {
  kind?: SearchDoc['kind'];
  status?: string;
  verdict?: string;
  /** Reviews whose verdict the searcher must not learn (lib/rounds/freeze.ts, blindReviewIds). */
  blindReviewIds?: ReadonlySet<number>;
  tag?: string;
  limit?: number;
}

export interface SearchHit {
  doc: SearchDoc;
  score: number;
  matches: MatchDTO[];
}

function passes(doc: SearchDoc, f: SearchFilters): boolean {
  if (f.kind && doc.kind !== f.kind) return false;
  if (f.status || f.verdict || f.tag) {
    // Status, verdict and tag describe reviews; a mechanism or study passes when the filter does not concern it.
    if (doc.kind === 'review') {
      if (f.status && doc.status !== f.status) return false;
      // A review scored blind by the searcher never matches a verdict filter (it would tell the verdict).
      if (f.verdict && (doc.verdict !== f.verdict || f.blindReviewIds?.has(doc.id))) return false;
      if (f.tag && !doc.tags.includes(f.tag.toLowerCase())) return false;
    } else if (f.tag && doc.kind === 'study') {
      if (!doc.tags.includes(f.tag.toLowerCase())) return false;
    } else if (f.status || f.verdict) return false;
  }
  return true;
}

export function searchIndex(index: FuzzyIndex<SearchDoc>, q: string, filters: SearchFilters = {}): SearchHit[] {
  return index
    .search(q, { filter: (doc) => passes(doc, filters), limit: filters.limit ?? 30 })
    .map((h) => ({ doc: h.doc, score: h.score, matches: h.matches }));
}

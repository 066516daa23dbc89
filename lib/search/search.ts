import { decide, type Actor } from '@/lib/auth/policy';
import { blindReviewIds } from '@/lib/rounds/freeze';
import type { MatchDTO } from '@/lib/publishing/types';
import type { SearchQuery } from '@/lib/validation/publishing';
import type { SearchFilters } from './documents';
import { searchTeams } from './index-store';

/** One search result as GET /api/search sends it. */
export interface SearchResultDTO {
  kind: 'review' | 'mechanism' | 'study';
  id: number;
  teamId: number;
  title: string;
  /** A line under the title: the claim, the review a mechanism belongs to, the journal. */
  detail: string;
  href: string;
  status?: string;
  verdict?: string | null;
  tags?: string[];
  score: number;
  matches: MatchDTO[];
}

/** The teams whose work the actor may search: a given team (the route checked it), else every team where they are staff. */
export function searchableTeams(actor: Actor, teamId?: number): number[] {
  if (teamId !== undefined) return [teamId];
  return [...actor.roles.keys()].filter((id) => decide(actor, 'search.read', { teamId: id }) === 'allow');
}

export async function searchForActor(actor: Actor, query: SearchQuery): Promise<SearchResultDTO[]> {
  // Blind scoring: the verdict of a review the searcher scores blind is neither shown nor filterable.
  const blind = await blindReviewIds(actor.userId);
  const filters: SearchFilters = {
    kind: query.kind,
    status: query.status,
    verdict: query.verdict,
    tag: query.tag,
    limit: query.limit,
    blindReviewIds: blind,
  };
  const hits = await searchTeams(searchableTeams(actor, query.teamId), query.q, filters);
  return hits.map(({ doc, score, matches }) => {
    switch (doc.kind) {
      case 'review':
        return {
          kind: 'review',
          id: doc.id,
          teamId: doc.teamId,
          title: doc.title,
          detail: doc.claim,
          href: `/reviews/${doc.id}`,
          status: doc.status,
          verdict: blind.has(doc.id) ? null : doc.verdict,
          tags: doc.tags,
          score,
          matches,
        };
      case 'mechanism':
        return {
          kind: 'mechanism',
          id: doc.id,
          teamId: doc.teamId,
          title: doc.name,
          detail: `In “${doc.reviewTitle}”`,
          href: `/reviews/${doc.reviewId}`,
          score,
          matches,
        };
      case 'study':
        return {
          kind: 'study',
          id: doc.id,
          teamId: doc.teamId,
          title: doc.title,
          detail: [doc.citation, doc.journal].filter(Boolean).join(' · '),
          href: `/library/${doc.id}`,
          tags: doc.tags,
          score,
          matches,
        };
    }
  });
}

/** Similar past reviews for a claim being typed: reviews only, title, claim and tags weigh most. */
export async function similarReviews(actor: Actor, teamId: number, claim: string): Promise<SearchResultDTO[]> {
  const results = await searchForActor(actor, { q: claim, teamId, kind: 'review', limit: 5 });
  return results.filter((r) => r.score < 0.6);
}

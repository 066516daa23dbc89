import { route } from '@/lib/auth/handler';
import { searchForActor } from '@/lib/search/search';
import { searchQuery } from '@/lib/validation/publishing';

// GET /api/search?q=&teamId=&kind=&status=&verdict=&tag= — fuzzy search over the team's reviews, mechanisms and studies, with matched ranges (staff).
export const GET = route({ query: searchQuery }, async ({ query, signedIn, authorize }) => {
  if (query.teamId !== undefined) authorize('search.read', { teamId: query.teamId }, 'That team');
  return { results: await searchForActor(signedIn(), query) };
});

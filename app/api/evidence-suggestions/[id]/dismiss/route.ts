import { route } from '@/lib/auth/handler';
import { dismissSuggestion, suggestionAccess } from '@/lib/watch/suggestions';
import { suggestionParams } from '@/lib/validation/watch';

// POST /api/evidence-suggestions/:id/dismiss — the verdict's author (or the owner) sets a "new evidence to consider" offer aside.
export const POST = route({ params: suggestionParams }, async ({ params, authorize, signedIn }) => {
  authorize('evidence.suggestion.dismiss', await suggestionAccess(params.id), 'That suggestion');
  await dismissSuggestion(params.id, signedIn().userId);
  return { dismissed: true };
});

import { route } from '@/lib/auth/handler';
import { listVerdicts } from '@/lib/publishing/queries';
import { verdictQuery } from '@/lib/validation/publishing';

// GET /api/verdicts?q=&teamId=&limit= — published verdicts this reader may see (public ones for anyone, the team's for members), newest first or best match first with q.
export const GET = route({ query: verdictQuery, auth: 'optional' }, async ({ query, actor }) => ({
  verdicts: await listVerdicts(actor, { q: query.q || undefined, teamId: query.teamId, limit: query.limit }),
}));

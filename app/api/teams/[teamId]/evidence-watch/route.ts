import { route } from '@/lib/auth/handler';
import { decide } from '@/lib/auth/policy';
import { startMemberRun, watchStatus } from '@/lib/watch/commands';
import { watchParams, watchRunQuery } from '@/lib/validation/watch';

// GET /api/teams/:teamId/evidence-watch — the latest run (progress or summary) and the verdicts flagged "evidence changed".
export const GET = route({ params: watchParams }, async ({ params, authorize, actor }) => {
  authorize('evidence.watch.read', { teamId: params.teamId }, 'That team');
  return watchStatus(params.teamId, decide(actor, 'evidence.dryrun.read', { teamId: params.teamId }) === 'allow');
});

// POST /api/teams/:teamId/evidence-watch — run the watch now (owners and coaches); 202 with the run, or 200 when it is over with ?wait=1.
export const POST = route(
  { params: watchParams, query: watchRunQuery, slow: true },
  async ({ params, query, authorize, signedIn }) => {
    authorize('evidence.watch.run', { teamId: params.teamId }, 'That team');
    const wait = query.wait === '1';
    const run = await startMemberRun(params.teamId, signedIn(), wait);
    return Response.json({ run }, { status: wait ? 200 : 202 });
  },
);

import { route } from '@/lib/auth/handler';
import { follow, isFollowing, unfollow } from '@/lib/follows/follows';
import { teamParams } from '@/lib/validation/publishing';

// GET /api/teams/:teamId/follow — whether the caller follows the team.
export const GET = route({ params: teamParams }, async ({ params, signedIn }) => ({
  teamId: params.teamId,
  following: await isFollowing(signedIn().userId, params.teamId),
}));

// POST /api/teams/:teamId/follow — mail me the team's new verdicts (anyone signed in: members, or anyone for a team with public verdicts).
export const POST = route({ params: teamParams }, async ({ params, signedIn }) => follow(signedIn(), params.teamId));

// DELETE /api/teams/:teamId/follow — stop the mails.
export const DELETE = route({ params: teamParams }, async ({ params, signedIn }) =>
  unfollow(signedIn(), params.teamId),
);

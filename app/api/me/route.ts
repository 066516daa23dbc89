import { findUser } from '@/lib/auth/accounts';
import { route } from '@/lib/auth/handler';
import { teamsOf } from '@/lib/teams/teams';

// GET /api/me — the signed-in user and their teams with the role in each.
export const GET = route({}, async ({ signedIn }) => {
  const { userId } = signedIn();
  return { user: await findUser(userId), teams: await teamsOf(userId) };
});

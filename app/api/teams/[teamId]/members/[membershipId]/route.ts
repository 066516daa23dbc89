import { route } from '@/lib/auth/handler';
import { changeRole, removeMember } from '@/lib/teams/members';
import { memberParams, roleChangeSchema } from '@/lib/validation/auth';

// PATCH /api/teams/:teamId/members/:membershipId — changes a member's role (owner).
export const PATCH = route({ params: memberParams, body: roleChangeSchema }, async ({ params, body, authorize, signedIn }) => {
  authorize('team.members.update', { teamId: params.teamId }, 'That team');
  return { member: await changeRole(signedIn().userId, params.teamId, params.membershipId, body.role) };
});

// DELETE /api/teams/:teamId/members/:membershipId — removes a member (owner); the last owner stays.
export const DELETE = route({ params: memberParams }, async ({ params, authorize, signedIn }) => {
  authorize('team.members.remove', { teamId: params.teamId }, 'That team');
  await removeMember(signedIn().userId, params.teamId, params.membershipId);
  return { ok: true };
});

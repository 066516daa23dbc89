import { route } from '@/lib/auth/handler';
import { inviteMember } from '@/lib/teams/invitations';
import { listMembers } from '@/lib/teams/members';
import { inviteSchema, teamParams } from '@/lib/validation/auth';

// GET /api/teams/:teamId/members — members and open invitations (owner).
export const GET = route({ params: teamParams }, async ({ params, authorize }) => {
  authorize('team.members.list', { teamId: params.teamId }, 'That team');
  return listMembers(params.teamId);
});

// POST /api/teams/:teamId/members — invites by e-mail with a role (owner).
export const POST = route({ params: teamParams, body: inviteSchema }, async ({ params, body, authorize, signedIn }) => {
  authorize('team.members.invite', { teamId: params.teamId }, 'That team');
  const invitation = await inviteMember(signedIn().userId, params.teamId, body);
  return Response.json({ invitation }, { status: 201 });
});

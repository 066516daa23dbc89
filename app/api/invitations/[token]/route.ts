import { route } from '@/lib/auth/handler';
import { viewInvitation } from '@/lib/teams/invitations';
import { tokenParams } from '@/lib/validation/auth';

// GET /api/invitations/:token — which team and role the link offers.
export const GET = route({ auth: 'optional', params: tokenParams }, async ({ params }) => ({
  invitation: await viewInvitation(params.token),
}));

import { badRequest } from '@/lib/api/errors';
import { route } from '@/lib/auth/handler';
import { acceptInvitation } from '@/lib/teams/invitations';
import { acceptInvitationSchema, tokenParams } from '@/lib/validation/auth';
import { startSession } from '@/lib/auth/sessions';

// POST /api/invitations/:token/accept — joins the team: signed in as yourself, or `{name, password}` for a new account.
export const POST = route(
  { auth: 'optional', params: tokenParams, body: acceptInvitationSchema },
  async ({ params, body, actor, session }) => {
    let who: { userId: number } | { name: string; password: string };
    if (actor) who = { userId: actor.userId };
    else if ('name' in body) who = { name: body.name as string, password: body.password as string };
    else
      throw badRequest('Sign in, or give a name and password to create your account.', [
        { path: 'name', message: 'Required when signed out.' },
      ]);
    const result = await acceptInvitation(params.token, who);
    await startSession(session, result.userId);
    return result;
  },
);

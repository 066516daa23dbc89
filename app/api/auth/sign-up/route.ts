import { signUp } from '@/lib/auth/accounts';
import { route } from '@/lib/auth/handler';
import { signUpSchema } from '@/lib/validation/auth';
import { startSession } from '@/lib/auth/sessions';

// POST /api/auth/sign-up — creates an account and its team (the new user is owner), signs in.
export const POST = route({ auth: 'optional', body: signUpSchema }, async ({ body, session }) => {
  const result = await signUp(body);
  await startSession(session, result.user.id);
  return Response.json(result, { status: 201 });
});

import { route } from '@/lib/auth/handler';
import { startSession } from '@/lib/auth/sessions';
import { confirmSignUp } from '@/lib/auth/sign-up';
import { signUpConfirmSchema } from '@/lib/validation/auth';

// POST /api/auth/sign-up/confirm — the mailed link creates the account and its team; signs in.
export const POST = route({ auth: 'optional', body: signUpConfirmSchema }, async ({ body, session }) => {
  const result = await confirmSignUp(body.token);
  await startSession(session, result.user.id);
  return Response.json(result, { status: 201 });
});

import { signUp } from '@/lib/auth/accounts';
import { route } from '@/lib/auth/handler';
import { signUpSchema } from '@/lib/validation/auth';

// POST /api/auth/sign-up — creates an account and its team (the new user is owner), signs in.
export const POST = route({ auth: 'optional', body: signUpSchema }, async ({ body, session }) => {
  const result = await signUp(body);
  session.userId = result.user.id;
  await session.save();
  return Response.json(result, { status: 201 });
});

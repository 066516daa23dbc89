import { route } from '@/lib/auth/handler';
import { resendSignUp } from '@/lib/auth/sign-up';
import { signUpResendSchema } from '@/lib/validation/auth';

// POST /api/auth/sign-up/resend — a new link for a waiting sign-up; the same 202 for every address.
export const POST = route({ auth: 'optional', body: signUpResendSchema }, async ({ body }) => {
  resendSignUp(body.email);
  return Response.json({ status: 'check-your-mail' }, { status: 202 });
});

import { route } from '@/lib/auth/handler';
import { resendSignUp } from '@/lib/auth/sign-up';
import { signUpResendSchema } from '@/lib/validation/auth';

// POST /api/auth/sign-up/resend — a new link for a waiting sign-up; the same 202 for every address;
// 429 past the mail limit of the client address (lib/auth/mail-limit.ts).
export const POST = route({ auth: 'optional', body: signUpResendSchema }, async ({ body, address }) => {
  await resendSignUp(body.email, address);
  return Response.json({ status: 'check-your-mail' }, { status: 202 });
});

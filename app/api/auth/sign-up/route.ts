import { route } from '@/lib/auth/handler';
import { requestSignUp } from '@/lib/auth/sign-up';
import { signUpSchema } from '@/lib/validation/auth';

// POST /api/auth/sign-up — 202, the same answer for every address; the mail (a link, or "you
// already have an account") goes out after it (lib/auth/sign-up.ts); 429 past the mail limit of
// the client address (lib/auth/mail-limit.ts).
export const POST = route({ auth: 'optional', body: signUpSchema }, async ({ body, address }) => {
  await requestSignUp(body, address);
  return Response.json({ status: 'check-your-mail' }, { status: 202 });
});

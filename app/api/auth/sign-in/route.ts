import { authenticate } from '@/lib/auth/accounts';
import { route } from '@/lib/auth/handler';
import { signInSchema } from '@/lib/validation/auth';
import { startSession } from '@/lib/auth/sessions';

// POST /api/auth/sign-in — sets the session cookie; 429 with Retry-After after 5 failures in 15 minutes.
export const POST = route({ auth: 'optional', body: signInSchema }, async ({ body, session, address }) => {
  const user = await authenticate(body, address);
  await startSession(session, user.id);
  return { user };
});

import { route } from '@/lib/auth/handler';
import { signOut } from '@/lib/auth/sessions';

// POST /api/auth/sign-out — ends the session.
export const POST = route({}, async ({ session }) => {
  await signOut(session);
  return { ok: true };
});

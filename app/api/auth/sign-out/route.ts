import { route } from '@/lib/auth/handler';

// POST /api/auth/sign-out — ends the session.
export const POST = route({}, async ({ session }) => {
  session.destroy();
  return { ok: true };
});

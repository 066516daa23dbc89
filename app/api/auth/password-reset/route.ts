import { requestPasswordReset } from '@/lib/auth/accounts';
import { route } from '@/lib/auth/handler';
import { resetRequestSchema } from '@/lib/validation/auth';

// POST /api/auth/password-reset — mails a one-hour, single-use link; the same answer for unknown addresses.
export const POST = route({ auth: 'optional', body: resetRequestSchema }, async ({ body }) => {
  await requestPasswordReset(body.email);
  return Response.json({ ok: true }, { status: 202 });
});

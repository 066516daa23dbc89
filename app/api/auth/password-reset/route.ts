import { requestPasswordReset } from '@/lib/auth/accounts';
import { route } from '@/lib/auth/handler';
import { resetRequestSchema } from '@/lib/validation/auth';

// POST /api/auth/password-reset — mails a one-hour, single-use link; the same answer for unknown
// addresses; 429 past the mail limit of the client address (lib/auth/mail-limit.ts).
export const POST = route({ auth: 'optional', body: resetRequestSchema }, async ({ body, address }) => {
  await requestPasswordReset(body.email, address);
  return Response.json({ ok: true }, { status: 202 });
});

import { requestPasswordReset } from '@/lib/auth/accounts';
import { route } from '@/lib/auth/handler';
import { takeMailRequest } from '@/lib/auth/mail-limit';
import { resetRequestSchema } from '@/lib/validation/auth';

// POST /api/auth/password-reset — mails a one-hour, single-use link; the same answer for unknown
// addresses; 429 past the mail limit of the client address (lib/auth/mail-limit.ts).
export const POST = route({ auth: 'optional', body: resetRequestSchema }, async ({ body, address }) => {
  await takeMailRequest(address);
  await requestPasswordReset(body.email);
  return Response.json({ ok: true }, { status: 202 });
});

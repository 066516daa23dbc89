import { confirmPasswordReset } from '@/lib/auth/accounts';
import { route } from '@/lib/auth/handler';
import { resetConfirmSchema } from '@/lib/validation/auth';

// POST /api/auth/password-reset/confirm — sets a new password from an e-mailed token.
export const POST = route({ auth: 'optional', body: resetConfirmSchema }, async ({ body }) => {
  const user = await confirmPasswordReset(body.token, body.password);
  return { user };
});

import { changePassword } from '@/lib/auth/accounts';
import { route } from '@/lib/auth/handler';
import { startSession } from '@/lib/auth/sessions';
import { changePasswordSchema } from '@/lib/validation/auth';

// POST /api/auth/password — changes the signed-in person's password; every other session ends.
export const POST = route({ body: changePasswordSchema }, async ({ body, session, signedIn, address }) => {
  const user = await changePassword(signedIn().userId, body, address);
  await startSession(session, user.id);
  return { user };
});

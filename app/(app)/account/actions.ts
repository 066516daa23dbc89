'use server';

import { changePassword } from '@/lib/auth/accounts';
import { formAction } from '@/lib/auth/action';
import { startSession } from '@/lib/auth/sessions';
import { changePasswordSchema } from '@/lib/validation/auth';

/** Changes the password; every other session of the person ends, this browser stays signed in. */
export const changePasswordAction = formAction(changePasswordSchema, async (data, { session, signedIn, address }) => {
  const user = await changePassword(signedIn().userId, data, address);
  await startSession(session, user.id);
  return { ok: true, message: 'Your password is changed. Every other device where you were signed in is signed out.' };
});

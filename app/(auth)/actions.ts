'use server';

import { redirect } from 'next/navigation';
import { z } from 'zod';
import { safeNextPath } from '@/components/auth/next-path';
import { formAction } from '@/lib/auth/action';
import { authenticate, confirmPasswordReset, requestPasswordReset } from '@/lib/auth/accounts';
import { confirmSignUp, requestSignUp, resendSignUp } from '@/lib/auth/sign-up';
import { acceptInvitation } from '@/lib/teams/invitations';
import {
  resetConfirmSchema,
  resetRequestSchema,
  signInSchema,
  signUpConfirmSchema,
  signUpResendSchema,
  signUpSchema,
} from '@/lib/validation/auth';
import { startSession, signOut } from '@/lib/auth/sessions';

// The forms carry where to return to and which invitation they answer; the shared schemas don't.
const next = z.string().optional();
const token = z
  .string({ error: 'The invitation link is incomplete.' })
  .min(10, { error: 'The invitation link is incomplete.' });

export const signInAction = formAction(signInSchema.extend({ next }), async (data, { session, address }) => {
  const user = await authenticate({ email: data.email, password: data.password }, address);
  await startSession(session, user.id);
  redirect(safeNextPath(data.next));
});

/** The same answer for every address: what happens next is in the mail (lib/auth/sign-up.ts). */
export const signUpAction = formAction(signUpSchema.extend({ next }), async (data, { address }) => {
  await requestSignUp(
    { name: data.name, email: data.email, password: data.password, teamName: data.teamName },
    address,
  );
  return { ok: true, values: { email: data.email, name: data.name, teamName: data.teamName } };
});

export const resendSignUpAction = formAction(signUpResendSchema, async (data, { address }) => {
  await resendSignUp(data.email, address);
  return { ok: true, message: `We sent the link to ${data.email} again.`, values: { email: data.email } };
});

export const confirmSignUpAction = formAction(signUpConfirmSchema, async (data, { session }) => {
  const { user } = await confirmSignUp(data.token);
  await startSession(session, user.id);
  redirect('/dashboard');
});

export const requestResetAction = formAction(resetRequestSchema, async (data, { address }) => {
  await requestPasswordReset(data.email, address);
  return {
    ok: true,
    message: `If an account uses ${data.email}, a reset link is on its way. It works once, for one hour.`,
  };
});

export const confirmResetAction = formAction(resetConfirmSchema, async (data) => {
  await confirmPasswordReset(data.token, data.password);
  return { ok: true, message: 'Your password is changed. Sign in with the new one.' };
});

/** Joining as the person already signed in: nothing to fill in. */
export const joinAsMemberAction = formAction(z.object({ token }), async (data, { session, signedIn }) => {
  const result = await acceptInvitation(data.token, { userId: signedIn().userId });
  await startSession(session, result.userId);
  redirect('/dashboard');
});

/** Joining with a new account under the invited address. */
export const joinWithAccountAction = formAction(
  signUpSchema.pick({ name: true, password: true }).extend({ token }),
  async (data, { session }) => {
    const result = await acceptInvitation(data.token, { name: data.name, password: data.password });
    await startSession(session, result.userId);
    redirect('/dashboard');
  },
);

export const signOutAction = formAction(z.object({}), async (_data, { session }) => {
  await signOut(session);
  redirect('/');
});

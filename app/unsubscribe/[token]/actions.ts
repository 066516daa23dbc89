'use server';

import { formAction } from '@/lib/auth/action';
import { unsubscribe } from '@/lib/follows/follows';
import { unsubscribeForm } from '@/lib/validation/publishing';

// A button, not the GET of the link, stops the mails: mail scanners open links and must not unsubscribe anyone.
// Signed out is the rule here: the signed token is the permission (lib/follows/follows.ts).
export const unsubscribeAction = formAction(unsubscribeForm, async ({ token }) => {
  const result = await unsubscribe(token);
  if (!result) return { message: 'This link is no longer valid: you may already have stopped these mails.' };
  return { ok: true };
});

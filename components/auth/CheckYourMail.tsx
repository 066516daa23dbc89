'use client';

import { useActionState } from 'react';
import { resendSignUpAction } from '@/app/(auth)/actions';
import { Button } from '@/components/ui/Button';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';

/**
 * After sign-up: the same words for every address (a new one gets the link, one with an account
 * a note to sign in), with a way to have the mail sent again or to correct the address.
 */
export function CheckYourMail({ email, onChangeAddress }: { email: string; onChangeAddress: () => void }) {
  const [state, action] = useActionState(resendSignUpAction, {});
  return (
    <div className="space-y-5" data-testid="check-your-mail">
      <div role="status" aria-live="polite" className="space-y-2">
        <h2 className="text-lg font-semibold">Check your mail</h2>
        <p>
          We sent a message to <strong className="break-all">{email}</strong>. Open the link in it within 24 hours to
          create your account and your team.
        </p>
        <p className="text-ink-muted text-sm">
          If this address already has an account, the message says so instead: sign in, or reset the password.
        </p>
      </div>
      <FormMessage state={state} />
      <form action={action} className="space-y-3">
        <input type="hidden" name="email" value={email} />
        <p className="text-ink-muted text-sm">Nothing after a few minutes? Look in the spam folder, then:</p>
        <div className="flex flex-col gap-3 sm:flex-row">
          <SubmitButton variant="secondary" className="sm:flex-1">
            Send it again
          </SubmitButton>
          <Button variant="ghost" className="sm:flex-1" onClick={onChangeAddress}>
            Use a different address
          </Button>
        </div>
      </form>
    </div>
  );
}

'use client';

import { useActionState } from 'react';
import { unsubscribeAction } from '@/app/unsubscribe/[token]/actions';
import type { FormState } from '@/lib/auth/action';
import { SubmitButton } from '@/components/ui/SubmitButton';

export function UnsubscribeForm({ token, teamName }: { token: string; teamName: string }) {
  const [state, action] = useActionState<FormState, FormData>(unsubscribeAction, {});
  if (state.ok) {
    return (
      <p role="status" className="mt-4">
        Done: you will get no more e-mails about {teamName}’s verdicts. You can follow the team again from its verdicts
        page.
      </p>
    );
  }
  return (
    <form action={action} className="mt-4 space-y-4">
      <p>You get an e-mail when {teamName} publishes a new verdict or a new version of one.</p>
      <input type="hidden" name="token" value={token} />
      <SubmitButton>Stop these e-mails</SubmitButton>
      <div aria-live="polite">{state.message && <p className="text-danger-700">{state.message}</p>}</div>
    </form>
  );
}

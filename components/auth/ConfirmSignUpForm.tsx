'use client';

import { useActionState } from 'react';
import { confirmSignUpAction } from '@/app/(auth)/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';

export function ConfirmSignUpForm({ token }: { token: string }) {
  const [state, action] = useActionState(confirmSignUpAction, {});
  return (
    <form action={action} className="space-y-5">
      <input type="hidden" name="token" value={token} />
      <FormMessage state={state} />
      <SubmitButton className="w-full">Create my account and team</SubmitButton>
    </form>
  );
}

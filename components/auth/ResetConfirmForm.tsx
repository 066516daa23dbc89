'use client';

import { useActionState } from 'react';
import { confirmResetAction } from '@/app/(auth)/actions';
import { LinkButton } from '@/components/ui/Button';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';
import { TextField } from '@/components/ui/Field';

export function ResetConfirmForm({ token }: { token: string }) {
  const [state, action] = useActionState(confirmResetAction, {});
  if (state.ok) {
    return (
      <div className="space-y-5">
        <FormMessage state={state} />
        <LinkButton href="/sign-in" variant="primary" className="w-full">
          Go to sign in
        </LinkButton>
      </div>
    );
  }
  return (
    <form action={action} noValidate className="space-y-5">
      <input type="hidden" name="token" value={token} />
      <FormMessage state={state} />
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        help="At least 10 characters."
        errors={state.errors?.password ?? state.errors?.token}
      />
      <SubmitButton className="w-full">Set new password</SubmitButton>
    </form>
  );
}

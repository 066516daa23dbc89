'use client';

import { useActionState } from 'react';
import { changePasswordAction } from '@/app/(app)/account/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';
import { TextField } from '@/components/ui/Field';

export function ChangePasswordForm() {
  const [state, action] = useActionState(changePasswordAction, {});
  return (
    // A new key after a success empties the password fields.
    <form key={state.ok ? 'done' : 'editing'} action={action} noValidate className="space-y-5">
      <FormMessage state={state} />
      <TextField
        label="Current password"
        name="currentPassword"
        type="password"
        autoComplete="current-password"
        errors={state.errors?.currentPassword}
      />
      <TextField
        label="New password"
        name="newPassword"
        type="password"
        autoComplete="new-password"
        help="At least 10 characters. A short sentence is easier to remember than symbols."
        errors={state.errors?.newPassword}
      />
      <SubmitButton className="w-full sm:w-auto">Change password</SubmitButton>
    </form>
  );
}

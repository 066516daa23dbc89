'use client';

import { useActionState } from 'react';
import { requestResetAction } from '@/app/(auth)/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';
import { TextField } from '@/components/ui/Field';

export function ResetRequestForm() {
  const [state, action] = useActionState(requestResetAction, {});
  return (
    <form action={action} noValidate className="space-y-5">
      <FormMessage state={state} />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        inputMode="email"
        help="We send a link to choose a new password."
        defaultValue={state.values?.email}
        errors={state.errors?.email}
      />
      <SubmitButton className="w-full">Send reset link</SubmitButton>
    </form>
  );
}

'use client';

import { useActionState } from 'react';
import { signUpAction } from '@/app/(auth)/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';
import { TextField } from '@/components/ui/Field';

export function SignUpForm({ next }: { next?: string }) {
  const [state, action] = useActionState(signUpAction, {});
  return (
    <form action={action} noValidate className="space-y-5">
      {next && <input type="hidden" name="next" value={next} />}
      <FormMessage state={state} />
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        defaultValue={state.values?.name}
        errors={state.errors?.name}
      />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        inputMode="email"
        defaultValue={state.values?.email}
        errors={state.errors?.email}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        help="At least 10 characters. A short sentence is easier to remember than symbols."
        errors={state.errors?.password}
      />
      <TextField
        label="Team name"
        name="teamName"
        autoComplete="organization"
        help="Your club, clinic or coaching group. You are its owner and can invite the others."
        placeholder="e.g. Northside Climbing Squad"
        defaultValue={state.values?.teamName}
        errors={state.errors?.teamName}
      />
      <SubmitButton className="w-full">Create account</SubmitButton>
    </form>
  );
}

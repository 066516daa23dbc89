'use client';

import { useActionState, useState } from 'react';
import { signUpAction } from '@/app/(auth)/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';
import { TextField } from '@/components/ui/Field';
import { CheckYourMail } from './CheckYourMail';

export function SignUpForm({ next }: { next?: string }) {
  const [state, action] = useActionState(signUpAction, {});
  // "Use a different address" returns to the form, keeping what was typed (but the password).
  const [leftBehind, setLeftBehind] = useState<object | null>(null);
  const sentTo = state.ok && state !== leftBehind ? state.values?.email : undefined;
  if (sentTo) return <CheckYourMail email={sentTo} onChangeAddress={() => setLeftBehind(state)} />;
  return (
    <form action={action} noValidate className="space-y-5">
      {next && <input type="hidden" name="next" value={next} />}
      <FormMessage state={state.ok ? {} : state} />
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
        help="We send a link there; your account is created when you open it."
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

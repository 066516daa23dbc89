'use client';

import { useActionState } from 'react';
import { joinAsMemberAction, joinWithAccountAction } from '@/app/(auth)/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';
import { TextField } from '@/components/ui/Field';

/** Signed in: one button joins with the current account. */
export function JoinAsMemberForm({ token }: { token: string }) {
  const [state, action] = useActionState(joinAsMemberAction, {});
  return (
    <form action={action} className="space-y-4">
      <input type="hidden" name="token" value={token} />
      <FormMessage state={state} />
      <SubmitButton className="w-full">Join team</SubmitButton>
    </form>
  );
}

/** Signed out and new here: the invited address becomes the account, so only name and password are asked. */
export function JoinWithAccountForm({ token, email }: { token: string; email: string }) {
  const [state, action] = useActionState(joinWithAccountAction, {});
  return (
    <form action={action} noValidate className="space-y-5">
      <input type="hidden" name="token" value={token} />
      <FormMessage state={state} />
      <TextField
        label="E-mail"
        type="email"
        value={email}
        readOnly
        autoComplete="username"
        help="The address the invitation was sent to."
      />
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        defaultValue={state.values?.name}
        errors={state.errors?.name}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        help="At least 10 characters."
        errors={state.errors?.password}
      />
      <SubmitButton className="w-full">Join team</SubmitButton>
    </form>
  );
}

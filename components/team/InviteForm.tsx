'use client';

import { useActionState } from 'react';
import { inviteAction } from '@/app/(app)/team/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SelectField, TextField } from '@/components/ui/Field';
import { SubmitButton } from '@/components/ui/SubmitButton';
import { ROLE_OPTIONS } from './roles';

export function InviteForm({ teamId }: { teamId: number }) {
  const [state, action] = useActionState(inviteAction, {});
  // A new key after each answer remounts the fields: cleared after a success, refilled with
  // what was typed after a failure (a select ignores a changed defaultValue otherwise).
  const key = JSON.stringify([state.ok, state.message, state.values]);
  return (
    <div className="space-y-4">
      <FormMessage state={state} />
      <form action={action} noValidate className="space-y-4" key={key}>
        <input type="hidden" name="teamId" value={teamId} />
        <div className="space-y-4">
          <TextField
            label="E-mail"
            name="email"
            type="email"
            autoComplete="off"
            inputMode="email"
            placeholder="name@example.com"
            defaultValue={state.values?.email}
            errors={state.errors?.email}
          />
          <SelectField
            label="Role"
            name="role"
            options={ROLE_OPTIONS}
            defaultValue={state.values?.role ?? 'coach'}
            errors={state.errors?.role}
          />
        </div>
        <SubmitButton>Send invitation</SubmitButton>
      </form>
    </div>
  );
}

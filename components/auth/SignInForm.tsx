'use client';

import Link from 'next/link';
import { useActionState } from 'react';
import { signInAction } from '@/app/(auth)/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';
import { TextField } from '@/components/ui/Field';

export function SignInForm({ next }: { next?: string }) {
  const [state, action] = useActionState(signInAction, {});
  return (
    <form action={action} noValidate className="space-y-5">
      {next && <input type="hidden" name="next" value={next} />}
      <FormMessage state={state} />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="username"
        inputMode="email"
        defaultValue={state.values?.email}
        errors={state.errors?.email}
      />
      <div className="space-y-1.5">
        <TextField
          label="Password"
          name="password"
          type="password"
          autoComplete="current-password"
          errors={state.errors?.password}
        />
        <p className="text-right text-sm">
          <Link href="/reset-password" className="prose-link">
            Forgot your password?
          </Link>
        </p>
      </div>
      <SubmitButton className="w-full">Sign in</SubmitButton>
    </form>
  );
}

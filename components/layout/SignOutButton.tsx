'use client';

import { useActionState } from 'react';
import { signOutAction } from '@/app/(auth)/actions';
import { SubmitButton } from '@/components/ui/SubmitButton';

export function SignOutButton() {
  const [, action] = useActionState(signOutAction, {});
  return (
    <form action={action}>
      <SubmitButton variant="secondary" size="sm">
        Sign out
      </SubmitButton>
    </form>
  );
}

'use client';

import { useFormStatus } from 'react-dom';
import { Button, type ButtonProps } from './Button';
import { Spinner } from './Spinner';

/**
 * The submit button of a form: disabled with a spinner while its form's action runs, so nobody
 * double-submits. The label stays the same, because people (and browser tests) find it by name.
 */
export function SubmitButton({ children, disabled, ...props }: Omit<ButtonProps, 'type'>) {
  const { pending } = useFormStatus();
  return (
    <Button type="submit" disabled={pending || disabled} aria-busy={pending || undefined} {...props}>
      {pending && <Spinner />}
      {children}
    </Button>
  );
}

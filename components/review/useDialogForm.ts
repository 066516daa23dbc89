'use client';

import { useState } from 'react';
import { focusFirstInvalid, withoutFieldError } from '@/components/ui/form-errors';
import { ApiError, errorMessage } from '@/lib/swr/fetcher';

/**
 * The state every workbench dialog form keeps the same way: field errors, the form's message,
 * and which of save or delete is running (for FormFooter). A refused save keeps what was typed,
 * marks the fields the server named and moves focus to the first of them.
 */
export function useDialogForm<T>({
  onSubmit,
  onDelete,
}: {
  onSubmit: (data: T) => Promise<unknown>;
  onDelete?: () => Promise<unknown>;
}) {
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | undefined>();
  const [busy, setBusy] = useState<'save' | 'delete' | null>(null);

  /** The form's own check failed: show why, send nothing. */
  const refuse = (form: HTMLFormElement, found: Record<string, string[]>, text = 'Check the fields marked below.') => {
    setErrors(found);
    setMessage(text);
    focusFirstInvalid(form);
  };

  const save = async (form: HTMLFormElement, data: T) => {
    setErrors({});
    setMessage(undefined);
    setBusy('save');
    try {
      await onSubmit(data);
    } catch (error) {
      if (error instanceof ApiError && error.issues.length) setErrors(error.fieldErrors());
      focusFirstInvalid(form);
      setMessage(errorMessage(error));
      setBusy(null);
    }
  };

  const remove = async () => {
    if (!onDelete) return;
    setBusy('delete');
    try {
      await onDelete();
    } catch (error) {
      setMessage(errorMessage(error));
      setBusy(null);
    }
  };

  /** A form's onChange: the changed field's error goes as soon as it is edited. */
  const clearChanged = (event: { target: EventTarget }) =>
    setErrors((current) => withoutFieldError(current, event.target));

  return { errors, message, busy, refuse, save, remove, clearChanged };
}

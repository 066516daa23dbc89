/** Field errors from a zod safeParse or an ApiError, keyed by dotted path. */
export function issuesToErrors(issues: ReadonlyArray<{ path: ReadonlyArray<PropertyKey> | string; message: string }>) {
  const errors: Record<string, string[]> = {};
  for (const issue of issues) {
    const key = typeof issue.path === 'string' ? issue.path : issue.path.map(String).join('.');
    const list = (errors[key || 'form'] ??= []);
    if (!list.includes(issue.message)) list.push(issue.message);
  }
  return errors;
}

/**
 * After a refused submit: bring the first field marked invalid into view and focus it, so the
 * coach does not face a form that looks unchanged while the messages sit off screen. Runs on
 * the next frame, once the error state has rendered.
 */
export function focusFirstInvalid(form: HTMLFormElement | null) {
  requestAnimationFrame(() => {
    const field = form?.querySelector<HTMLElement>('[aria-invalid="true"]');
    if (field) {
      field.focus();
      field.scrollIntoView({ block: 'center' });
      return;
    }
    // No single field to blame (a refused request, a missing pick): show the form's message.
    form?.querySelector<HTMLElement>('[role="alert"]')?.scrollIntoView({ block: 'center' });
  });
}

/**
 * The errors without the one of the field just changed (by its `name`, the dotted path), so a
 * message disappears as soon as the coach fixes the field instead of staying until the next
 * submit. Attach as a form's onChange: React's change event bubbles from every control.
 */
export function withoutFieldError(errors: Record<string, string[]>, changed: EventTarget | null) {
  const name = (changed as { name?: unknown } | null)?.name;
  if (typeof name !== 'string' || !(name in errors)) return errors;
  const rest = { ...errors };
  delete rest[name];
  return rest;
}

'use client';

import { useId, type ComponentProps, type ReactNode } from 'react';
import { cn } from '@/components/ui/cn';

/**
 * The two controls the workbench forms need beyond components/ui/Field (which has text and
 * select): a textarea and a checkbox, tied to help and error text the same way, so they read
 * and sound like the rest of the app's fields.
 */

function Errors({ id, errors }: { id: string; errors?: string[] }) {
  return (
    <div id={id} aria-live="polite" aria-atomic="true">
      {errors?.map((message) => (
        <p key={message} className="text-danger-700 flex items-start gap-1.5 text-sm font-medium">
          {/* The same mark components/ui/Field puts before its errors. */}
          <svg viewBox="0 0 16 16" className="mt-0.5 size-4 shrink-0" aria-hidden="true">
            <circle cx="8" cy="8" r="7" fill="currentColor" />
            <path d="M8 4.5v4.2M8 11.2v.3" stroke="white" strokeWidth="1.7" strokeLinecap="round" />
          </svg>
          {message}
        </p>
      ))}
    </div>
  );
}

export function TextAreaField({
  label,
  help,
  errors,
  optional,
  className,
  ...textarea
}: {
  label: ReactNode;
  help?: ReactNode;
  errors?: string[];
  optional?: boolean;
} & Omit<ComponentProps<'textarea'>, 'id'>) {
  const id = useId();
  const invalid = Boolean(errors?.length);
  const describedBy = [help ? `${id}-help` : '', invalid ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="text-ink block text-sm font-semibold">
        {label}
        {optional && <span className="text-ink-muted ml-1.5 font-normal">(optional)</span>}
      </label>
      {help && (
        <p id={`${id}-help`} className="text-ink-muted text-sm">
          {help}
        </p>
      )}
      <textarea
        id={id}
        aria-invalid={invalid || undefined}
        aria-describedby={describedBy}
        className={cn(
          'bg-paper-raised text-ink placeholder:text-ink-faint block min-h-24 w-full rounded-md border px-3 py-2.5 text-base',
          invalid
            ? 'border-danger-600 bg-danger-50/40'
            : 'border-line-strong hover:border-chalk-400 focus:border-brand',
          className,
        )}
        {...textarea}
      />
      <Errors id={`${id}-error`} errors={errors} />
    </div>
  );
}

export function CheckboxField({
  label,
  help,
  errors,
  className,
  ...input
}: {
  label: ReactNode;
  help?: ReactNode;
  errors?: string[];
} & Omit<ComponentProps<'input'>, 'id' | 'type'>) {
  const id = useId();
  const invalid = Boolean(errors?.length);
  const describedBy = [help ? `${id}-help` : '', invalid ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div className={cn('space-y-1', className)}>
      <div className="flex items-start gap-3">
        <input
          id={id}
          type="checkbox"
          aria-invalid={invalid || undefined}
          aria-describedby={describedBy}
          className="border-line-strong accent-granite-700 mt-0.5 size-5 shrink-0 rounded"
          {...input}
        />
        <div className="space-y-0.5">
          <label htmlFor={id} className="text-ink block text-sm font-semibold">
            {label}
          </label>
          {help && (
            <p id={`${id}-help`} className="text-ink-muted text-sm">
              {help}
            </p>
          )}
        </div>
      </div>
      <Errors id={`${id}-error`} errors={errors} />
    </div>
  );
}

/** A set of radio buttons with a visible legend; the options sit side by side and wrap on a phone. */
export function RadioGroupField<V extends string>({
  legend,
  help,
  name,
  value,
  options,
  onChange,
  errors,
}: {
  legend: ReactNode;
  help?: ReactNode;
  name: string;
  value: V;
  options: ReadonlyArray<{ value: V; label: ReactNode; hint?: ReactNode }>;
  onChange: (value: V) => void;
  errors?: string[];
}) {
  const id = useId();
  return (
    <fieldset className="space-y-1.5" aria-describedby={help ? `${id}-help` : undefined}>
      <legend className="text-ink text-sm font-semibold">{legend}</legend>
      {help && (
        <p id={`${id}-help`} className="text-ink-muted text-sm">
          {help}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        {options.map((option) => (
          <label
            key={option.value}
            className={cn(
              'has-[:focus-visible]:outline-rope-500 flex min-h-11 cursor-pointer items-center gap-2 rounded-md border px-3 py-2 text-sm has-[:focus-visible]:outline-3',
              value === option.value
                ? 'border-brand bg-granite-50 font-semibold'
                : 'border-line-strong bg-paper-raised hover:border-chalk-400',
            )}
          >
            <input
              type="radio"
              name={name}
              value={option.value}
              checked={value === option.value}
              onChange={() => onChange(option.value)}
              className="accent-granite-700 size-4"
            />
            <span>
              {option.label}
              {option.hint && <span className="text-ink-muted block text-xs font-normal">{option.hint}</span>}
            </span>
          </label>
        ))}
      </div>
      <Errors id={`${id}-error`} errors={errors} />
    </fieldset>
  );
}

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

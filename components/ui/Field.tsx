import { useId, type ComponentProps, type ReactNode } from 'react';
import { cn } from './cn';

interface FieldFrame {
  label: ReactNode;
  /** Shown under the label; read out with the field. */
  help?: ReactNode;
  /** Field errors from the server action (FormState.errors[name]). */
  errors?: string[];
  /** Marks the field as optional in its label; required is the default in our forms. */
  optional?: boolean;
}

const CONTROL =
  'block w-full rounded-md border px-3 py-2.5 text-base text-ink shadow-[inset_0_1px_1px_rgb(33_31_27/0.04)] ' +
  'placeholder:text-ink-faint transition-colors disabled:bg-paper-sunken disabled:text-ink-muted [&[readonly]]:bg-paper-sunken';

function controlClasses(invalid: boolean, className?: string) {
  return cn(
    CONTROL,
    invalid
      ? 'border-danger-600 bg-danger-50'
      : 'border-line-strong bg-paper-raised hover:border-chalk-400 focus:border-brand',
    className,
  );
}

/** Ids that tie label, help and error to the control, so screen readers announce all three. */
function useFieldIds(errors?: string[], help?: ReactNode) {
  const id = useId();
  const helpId = help ? `${id}-help` : undefined;
  const errorId = `${id}-error`;
  const invalid = Boolean(errors?.length);
  const describedBy = [helpId, invalid ? errorId : undefined].filter(Boolean).join(' ') || undefined;
  return { id, helpId, errorId, invalid, describedBy };
}

/** Always rendered, so the live region exists before the first error arrives. */
function FieldErrors({ id, errors }: { id: string; errors?: string[] }) {
  return (
    <div id={id} aria-live="polite" aria-atomic="true">
      {errors?.map((message) => (
        <p key={message} className="text-danger-700 flex items-start gap-1.5 text-sm font-medium">
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

function Frame({
  id,
  helpId,
  errorId,
  label,
  help,
  errors,
  optional,
  children,
}: FieldFrame & { id: string; helpId?: string; errorId: string; children: ReactNode }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="text-ink block text-sm font-semibold">
        {label}
        {optional && <span className="text-ink-muted ml-1.5 font-normal">(optional)</span>}
      </label>
      {help && (
        <p id={helpId} className="text-ink-muted text-sm">
          {help}
        </p>
      )}
      {children}
      <FieldErrors id={errorId} errors={errors} />
    </div>
  );
}

export type TextFieldProps = FieldFrame & Omit<ComponentProps<'input'>, 'id'>;

export function TextField({ label, help, errors, optional, className, required, ...input }: TextFieldProps) {
  const { id, helpId, errorId, invalid, describedBy } = useFieldIds(errors, help);
  return (
    <Frame {...{ id, helpId, errorId, label, help, errors, optional }}>
      <input
        id={id}
        className={controlClasses(invalid, className)}
        aria-invalid={invalid || undefined}
        aria-describedby={describedBy}
        required={required ?? !optional}
        {...input}
      />
    </Frame>
  );
}

export type SelectFieldProps = FieldFrame &
  Omit<ComponentProps<'select'>, 'id' | 'children'> & {
    options: ReadonlyArray<{ value: string; label: string }>;
  };

export function SelectField({
  label,
  help,
  errors,
  optional,
  className,
  options,
  required,
  ...select
}: SelectFieldProps) {
  const { id, helpId, errorId, invalid, describedBy } = useFieldIds(errors, help);
  return (
    <Frame {...{ id, helpId, errorId, label, help, errors, optional }}>
      <div className="relative">
        <select
          id={id}
          className={controlClasses(invalid, cn('appearance-none pr-10', className))}
          aria-invalid={invalid || undefined}
          aria-describedby={describedBy}
          required={required ?? !optional}
          {...select}
        >
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
        <svg
          viewBox="0 0 16 16"
          className="text-ink-muted pointer-events-none absolute top-1/2 right-3 size-4 -translate-y-1/2"
          aria-hidden="true"
        >
          <path
            d="M4 6l4 4 4-4"
            fill="none"
            stroke="currentColor"
            strokeWidth="1.8"
            strokeLinecap="round"
            strokeLinejoin="round"
          />
        </svg>
      </div>
    </Frame>
  );
}

export type TextAreaFieldProps = FieldFrame & Omit<ComponentProps<'textarea'>, 'id'>;

export function TextAreaField({ label, help, errors, optional, className, ...textarea }: TextAreaFieldProps) {
  const { id, helpId, errorId, invalid, describedBy } = useFieldIds(errors, help);
  return (
    <Frame {...{ id, helpId, errorId, label, help, errors, optional }}>
      <textarea
        id={id}
        className={controlClasses(invalid, cn('min-h-24', className))}
        aria-invalid={invalid || undefined}
        aria-describedby={describedBy}
        {...textarea}
      />
    </Frame>
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
  const { id, helpId, errorId, invalid, describedBy } = useFieldIds(errors, help);
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
            <p id={helpId} className="text-ink-muted text-sm">
              {help}
            </p>
          )}
        </div>
      </div>
      <FieldErrors id={errorId} errors={errors} />
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
      <FieldErrors id={`${id}-error`} errors={errors} />
    </fieldset>
  );
}

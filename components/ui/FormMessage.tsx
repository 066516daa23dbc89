import type { FormState } from '@/lib/auth/action';
import { cn } from './cn';

/**
 * The one-line outcome of a form submit. Errors are an alert (read out at once); a success is a
 * status (read out when the reader is idle). The wrapper stays mounted so the live region works.
 */
export function FormMessage({ state, className }: { state: FormState; className?: string }) {
  const ok = state.ok === true;
  const text = state.message;
  return (
    <div role={ok ? 'status' : 'alert'} aria-live={ok ? 'polite' : 'assertive'} className={className}>
      {text && (
        <p
          className={cn(
            'flex items-start gap-2 rounded-md border px-3 py-2.5 text-sm font-medium',
            ok ? 'border-success-100 bg-success-50 text-success-800' : 'border-danger-100 bg-danger-50 text-danger-800',
          )}
        >
          <span aria-hidden="true" className="mt-0.5 font-bold">
            {ok ? '✓' : '!'}
          </span>
          <span>{text}</span>
        </p>
      )}
    </div>
  );
}

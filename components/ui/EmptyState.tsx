import type { ReactNode } from 'react';
import { cn } from './cn';

/** What an empty place means and the one next step that fills it. */
export function EmptyState({
  title,
  children,
  action,
  className,
}: {
  title: string;
  children?: ReactNode;
  action?: ReactNode;
  className?: string;
}) {
  return (
    <div
      className={cn(
        'border-line-strong bg-paper-sunken/60 flex flex-col items-center rounded-lg border border-dashed px-6 py-10 text-center',
        className,
      )}
    >
      <svg viewBox="0 0 48 48" className="text-chalk-400 mb-4 size-12" aria-hidden="true">
        <rect x="8" y="26" width="32" height="12" rx="2" fill="none" stroke="currentColor" strokeWidth="2" />
        <path d="M12 26c4-10 20-10 24 0" fill="none" stroke="#e16a17" strokeWidth="2" strokeLinecap="round" />
        <circle cx="24" cy="13" r="3" fill="currentColor" />
      </svg>
      <h2 className="text-lg font-semibold">{title}</h2>
      {children && <div className="max-w-measure text-ink-muted mt-2 text-sm">{children}</div>}
      {action && <div className="mt-5 flex flex-wrap justify-center gap-2">{action}</div>}
    </div>
  );
}

'use client';

import { useEffect, useId, useRef, type ReactNode } from 'react';
import { cn } from './cn';

/**
 * A modal built on the native <dialog>: the browser traps focus, makes the page behind it inert,
 * closes it on Escape and hands focus back to the opener — behaviour that is easy to get subtly
 * wrong by hand. Children mount only while open, so every opening starts from a fresh form.
 */
export function Dialog({
  open,
  onClose,
  title,
  description,
  children,
  wide = false,
}: {
  open: boolean;
  onClose: () => void;
  title: ReactNode;
  description?: ReactNode;
  children: ReactNode;
  wide?: boolean;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const descriptionId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
      onClose={onClose}
      className={cn(
        'border-line bg-paper-raised text-ink shadow-lift m-auto max-h-[92dvh] w-[calc(100vw-1rem)] overflow-y-auto rounded-lg border p-0',
        'backdrop:bg-chalk-950/45',
        wide ? 'max-w-3xl' : 'max-w-xl',
      )}
    >
      {open && (
        <div>
          <div className="border-line bg-paper-raised sticky top-0 z-10 flex items-start justify-between gap-3 border-b px-5 py-4">
            <div className="min-w-0 space-y-1">
              <h2 id={titleId} className="text-lg font-semibold">
                {title}
              </h2>
              {description && (
                <p id={descriptionId} className="text-ink-muted text-sm">
                  {description}
                </p>
              )}
            </div>
            <button
              type="button"
              onClick={onClose}
              className="text-ink-muted hover:bg-paper-sunken hover:text-ink -mr-2 inline-flex size-10 shrink-0 items-center justify-center rounded-md"
              aria-label="Close"
            >
              <svg viewBox="0 0 16 16" className="size-4" aria-hidden="true">
                <path d="M3.5 3.5l9 9M12.5 3.5l-9 9" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
              </svg>
            </button>
          </div>
          <div className="px-5 py-5">{children}</div>
        </div>
      )}
    </dialog>
  );
}

import type { ReactNode } from 'react';

/** The frame of every sign-in style page: one heading, one purpose, the form, then the way elsewhere. */
export function AuthCard({
  title,
  intro,
  children,
  footer,
}: {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
}) {
  return (
    <div className="max-w-form mx-auto w-full">
      <div className="border-line bg-paper-raised shadow-lift rounded-xl border px-5 py-7 sm:px-8">
        <h1 className="text-2xl font-semibold sm:text-3xl">{title}</h1>
        {intro && <div className="text-ink-muted mt-2">{intro}</div>}
        <div className="mt-6">{children}</div>
      </div>
      {footer && <div className="text-ink-muted mt-5 space-y-2 text-center text-sm">{footer}</div>}
    </div>
  );
}

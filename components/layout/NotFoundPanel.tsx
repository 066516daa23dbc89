import type { ReactNode } from 'react';
import { LinkButton } from '@/components/ui/Button';

/**
 * The body of a "not found" answer. It carries no header or <main> of its own, because Next
 * renders it inside whichever layout the missing thing was asked from (the app shell, or only
 * the root layout for an unknown address).
 */
export function NotFoundPanel({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-labelledby="not-found-heading" className="max-w-measure px-gutter mx-auto w-full py-16">
      <p className="font-display text-rope-500 text-5xl font-semibold" aria-hidden="true">
        404
      </p>
      <h1 id="not-found-heading" className="mt-2 text-3xl font-semibold">
        {title}
      </h1>
      <div className="text-ink-muted mt-3">{children}</div>
      <div className="mt-6 flex flex-wrap gap-2">
        <LinkButton href="/dashboard" variant="primary">
          Go to dashboard
        </LinkButton>
        <LinkButton href="/">Start page</LinkButton>
      </div>
    </section>
  );
}

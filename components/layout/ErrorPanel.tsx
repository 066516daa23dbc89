'use client';

import { useEffect } from 'react';
import { Button, LinkButton } from '@/components/ui/Button';

/**
 * What a segment shows when rendering failed. The message stays generic (the server hides
 * details in production anyway); the digest lets support match the server log.
 */
export function ErrorPanel({
  error,
  retry,
  home,
}: {
  error: unknown;
  retry: () => void;
  home: { href: string; label: string };
}) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  const digest =
    error instanceof Error && 'digest' in error ? String((error as Error & { digest?: string }).digest ?? '') : '';
  return (
    <div
      role="alert"
      className="max-w-measure border-danger-100 bg-paper-raised shadow-card mx-auto my-10 rounded-xl border px-6 py-8"
    >
      <p className="text-danger-700 text-sm font-semibold">Something went wrong</p>
      <h1 className="mt-1 text-2xl font-semibold">This page could not be loaded</h1>
      <p className="text-ink-muted mt-2">
        It may be a passing problem: try again. If it keeps happening, note the time and tell your team owner.
      </p>
      {digest && <p className="text-ink-faint mt-2 font-mono text-xs">Reference: {digest}</p>}
      <div className="mt-6 flex flex-wrap gap-2">
        <Button variant="primary" onClick={() => retry()}>
          Try again
        </Button>
        <LinkButton href={home.href}>{home.label}</LinkButton>
      </div>
    </div>
  );
}

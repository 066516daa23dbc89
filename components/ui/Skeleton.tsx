import type { ReactNode } from 'react';
import { cn } from './cn';

/** A grey placeholder block while a segment loads; hidden from screen readers (the region announces itself). */
export function Skeleton({ className }: { className?: string }) {
  return <div aria-hidden="true" className={cn('bg-chalk-200/70 animate-pulse rounded-md', className)} />;
}

/** What a loading page is inside: a live region that tells screen readers what is coming, once. */
export function LoadingRegion({
  label,
  className,
  children,
}: {
  label: string;
  className?: string;
  children: ReactNode;
}) {
  return (
    <div role="status" aria-live="polite" className={className}>
      <span className="sr-only">{label}</span>
      {children}
    </div>
  );
}

/**
 * A segment's loading page: bars stacked top to bottom, each sized (Tailwind classes) like the
 * part of the page it stands for, so the page does not jump when it arrives.
 */
export function PageSkeleton({ label, bars, className }: { label: string; bars: string[]; className?: string }) {
  return (
    <LoadingRegion label={label} className={cn('space-y-6', className)}>
      {bars.map((bar, i) => (
        <Skeleton key={i} className={bar} />
      ))}
    </LoadingRegion>
  );
}

import { cn } from './cn';

/** A grey placeholder block while a segment loads; hidden from screen readers (the region announces itself). */
export function Skeleton({ className }: { className?: string }) {
  return <div aria-hidden="true" className={cn('bg-chalk-200/70 animate-pulse rounded-md', className)} />;
}

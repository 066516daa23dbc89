import { Skeleton } from '@/components/ui/Skeleton';

export default function Loading() {
  return (
    <div role="status" aria-live="polite" className="max-w-3xl space-y-6">
      <span className="sr-only">Loading the form…</span>
      <Skeleton className="h-10 w-72 max-w-full" />
      <Skeleton className="h-64 w-full" />
      <Skeleton className="h-96 w-full" />
    </div>
  );
}

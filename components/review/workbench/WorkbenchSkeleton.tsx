import { Skeleton } from '@/components/ui/Skeleton';

export function WorkbenchSkeleton() {
  return (
    <div role="status" aria-live="polite" className="space-y-6">
      <span className="sr-only">Loading the review…</span>
      <Skeleton className="h-5 w-40" />
      <Skeleton className="h-10 w-3/4" />
      <Skeleton className="h-16 w-full" />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <Skeleton className="h-96" />
        <Skeleton className="h-96" />
      </div>
    </div>
  );
}

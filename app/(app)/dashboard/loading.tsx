import { LoadingRegion, Skeleton } from '@/components/ui/Skeleton';

export default function Loading() {
  return (
    <LoadingRegion label="Loading…" className="space-y-6">
      <div className="space-y-3">
        <Skeleton className="h-4 w-28" />
        <Skeleton className="h-10 w-64 max-w-full" />
        <Skeleton className="h-4 w-96 max-w-full" />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <Skeleton className="h-36" />
        <Skeleton className="h-36" />
      </div>
    </LoadingRegion>
  );
}

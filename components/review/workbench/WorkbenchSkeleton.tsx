import { LoadingRegion, Skeleton } from '@/components/ui/Skeleton';

/**
 * Shown while the server reads the review on a navigation. Laid out like the workbench (header,
 * then the text beside the verdict) and at least a screen tall, so that the page has its
 * scrollbar and the footer is below the fold from the first paint: when the review replaces
 * it, neither the page's width nor anything in view moves (a short placeholder made the whole
 * page jump sideways and the footer fly off screen — docs/architecture.md, "The workbench's
 * weight").
 */
export function WorkbenchSkeleton() {
  return (
    <LoadingRegion label="Loading the review…" className="min-h-dvh">
      <div className="space-y-4 pb-6">
        <Skeleton className="h-6 w-40" />
        <Skeleton className="h-9 w-3/4" />
        <Skeleton className="h-14 w-full" />
        <Skeleton className="h-16 w-2/3" />
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem] xl:grid-cols-[minmax(0,1fr)_24rem]">
        <Skeleton className="h-[40rem]" />
        <Skeleton className="hidden h-[32rem] lg:block" />
      </div>
    </LoadingRegion>
  );
}

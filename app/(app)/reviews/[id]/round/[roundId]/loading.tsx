import { PageSkeleton } from '@/components/ui/Skeleton';

export default function Loading() {
  return (
    <PageSkeleton label="Loading the scorecard…" bars={['h-5 w-48', 'h-10 w-3/4', 'h-64 w-full', 'h-64 w-full']} />
  );
}

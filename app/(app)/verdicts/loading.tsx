import { PageSkeleton } from '@/components/ui/Skeleton';

export default function Loading() {
  return (
    <PageSkeleton
      label="Loading the verdicts…"
      bars={['h-4 w-28', 'h-10 w-64 max-w-full', 'h-12 w-full', 'h-64 w-full']}
    />
  );
}

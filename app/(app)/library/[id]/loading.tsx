import { PageSkeleton } from '@/components/ui/Skeleton';

export default function Loading() {
  return <PageSkeleton label="Loading the study…" bars={['h-5 w-32', 'h-10 w-3/4', 'h-32 w-full', 'h-48 w-full']} />;
}

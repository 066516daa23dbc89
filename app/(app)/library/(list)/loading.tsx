import { PageSkeleton } from '@/components/ui/Skeleton';

export default function Loading() {
  return <PageSkeleton label="Loading the library…" bars={['h-10 w-64 max-w-full', 'h-48 w-full', 'h-72 w-full']} />;
}

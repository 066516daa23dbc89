import { PageSkeleton } from '@/components/ui/Skeleton';

export default function Loading() {
  return (
    <PageSkeleton
      label="Loading the form…"
      className="max-w-3xl"
      bars={['h-10 w-72 max-w-full', 'h-64 w-full', 'h-96 w-full']}
    />
  );
}

import { WorkbenchSkeleton } from '@/components/review/workbench/WorkbenchSkeleton';

export default function Loading() {
  return <WorkbenchSkeleton />;
}

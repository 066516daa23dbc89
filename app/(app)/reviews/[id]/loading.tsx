import { WorkbenchSkeleton } from '@/components/review/Workbench';

export default function Loading() {
  return <WorkbenchSkeleton />;
}

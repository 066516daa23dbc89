import { readableStudy } from '@/lib/auth/page-gates';

// Outside this segment's loading.tsx, so a missing or another team's study answers 404
// (lib/auth/page-gates.ts).
export default async function StudyGate({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ id: string }>;
}) {
  await readableStudy((await params).id);
  return children;
}

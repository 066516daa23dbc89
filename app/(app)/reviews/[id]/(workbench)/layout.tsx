import { readableReview } from '@/lib/auth/page-gates';

// Outside this segment's loading.tsx: a missing or another team's review answers 404, not a 200
// that streams the not-found UI (lib/auth/page-gates.ts).
export default async function WorkbenchGate({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ id: string }>;
}) {
  const { id } = await params;
  await readableReview(id, `/reviews/${id}`);
  return children;
}

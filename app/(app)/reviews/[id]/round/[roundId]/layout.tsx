import { invitedRound } from '@/lib/auth/page-gates';

// Outside this segment's loading.tsx, so the page's 404 is a real 404 (lib/auth/page-gates.ts).
export default async function ScorecardGate({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ id: string; roundId: string }>;
}) {
  const { id, roundId } = await params;
  await invitedRound(id, roundId);
  return children;
}

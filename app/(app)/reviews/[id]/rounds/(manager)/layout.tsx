import { roundsManagerAccess } from '@/lib/auth/page-gates';

// Outside this segment's loading.tsx, so the page's 404 is a real 404 (lib/auth/page-gates.ts).
export default async function RoundsGate({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ id: string }>;
}) {
  await roundsManagerAccess((await params).id);
  return children;
}

import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { cache } from 'react';
import { toViewer } from '@/components/review/viewer';
import { Workbench } from '@/components/review/Workbench';
import { readableReview } from '@/lib/auth/page-gates';
import { getWorkbench } from '@/lib/reviews/queries';
import { reviewVerdict } from '@/lib/reviews/verdict';
import { blindRoundFor } from '@/lib/rounds/freeze';
import { listRounds } from '@/lib/rounds/queries';

type Props = { params: Promise<{ id: string }> };

/** The workbench data; the layout has already answered 404 when the review is missing or not theirs. */
const load = cache(async (rawId: string) => {
  const { id, actor, access } = await readableReview(rawId, `/reviews/${rawId}`);
  // Blind scoring: an invited reviewer who has not submitted works on the scorecard, not here.
  const blind = await blindRoundFor(actor.userId, id);
  if (blind) redirect(`/reviews/${id}/round/${blind}`);
  // The first view whole: what the verdict and round routes would answer this reader (the
  // checks above are theirs: review.read, and not blind), so nothing is fetched after hydration
  // to fill it in (docs/architecture.md, "The workbench's weight").
  const [workbench, verdict, rounds] = await Promise.all([
    getWorkbench(id),
    reviewVerdict(id),
    listRounds(id, actor, access),
  ]);
  return { actor, workbench, firstView: { verdict: verdict ?? undefined, rounds } };
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { workbench } = await load((await params).id);
  return { title: workbench.review.title };
}

// GET /reviews/:id — the workbench: editor left, verdict right (stacked on a phone).
export default async function ReviewWorkbenchPage({ params }: Props) {
  const { actor, workbench, firstView } = await load((await params).id);
  return (
    <Workbench reviewId={workbench.review.id} viewer={toViewer(actor)} fallback={workbench} firstView={firstView} />
  );
}

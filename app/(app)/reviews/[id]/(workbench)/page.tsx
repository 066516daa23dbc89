import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { cache } from 'react';
import { toViewer } from '@/components/review/viewer';
import { Workbench } from '@/components/review/Workbench';
import { readableReview } from '@/lib/auth/page-gates';
import { getWorkbench } from '@/lib/reviews/queries';
import { blindRoundFor } from '@/lib/rounds/freeze';

type Props = { params: Promise<{ id: string }> };

/** The workbench data; the layout has already answered 404 when the review is missing or not theirs. */
const load = cache(async (rawId: string) => {
  const { id, actor } = await readableReview(rawId, `/reviews/${rawId}`);
  // Blind scoring: an invited reviewer who has not submitted works on the scorecard, not here.
  const blind = await blindRoundFor(actor.userId, id);
  if (blind) redirect(`/reviews/${id}/round/${blind}`);
  return { actor, workbench: await getWorkbench(id) };
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { workbench } = await load((await params).id);
  return { title: workbench.review.title };
}

// GET /reviews/:id — the workbench: editor left, verdict right (stacked on a phone).
export default async function ReviewWorkbenchPage({ params }: Props) {
  const { actor, workbench } = await load((await params).id);
  return <Workbench reviewId={workbench.review.id} viewer={toViewer(actor)} fallback={workbench} />;
}

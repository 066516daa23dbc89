import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { cache } from 'react';
import { RoundsManager } from '@/components/rounds/RoundsManager';
import { requirePageActor } from '@/lib/auth/current';
import { decide } from '@/lib/auth/policy';
import { listRounds, reviewHeadline } from '@/lib/rounds/queries';
import { getWorkbench, reviewAccess } from '@/lib/reviews/queries';

type Props = { params: Promise<{ id: string }> };

/** The author's and owner's round page; an invited reviewer is sent to their scorecard; anyone else 404. */
const load = cache(async (rawId: string) => {
  const id = Number(rawId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const actor = await requirePageActor(`/reviews/${rawId}/rounds`);
  const access = await reviewAccess(id).catch(() => null);
  if (!access || decide(actor, 'review.read', access) !== 'allow') notFound();
  const list = await listRounds(id, actor, access);
  if (decide(actor, 'review.round.settle', access) !== 'allow') {
    const mine = list.rounds[0];
    if (mine) redirect(`/reviews/${id}/round/${mine.id}`);
    notFound();
  }
  const [headline, workbench] = await Promise.all([reviewHeadline(id), getWorkbench(id)]);
  return { id, list, headline, mechanisms: workbench.mechanisms.map((m) => ({ id: m.id, name: m.name })) };
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { headline } = await load((await params).id);
  return { title: `Peer review: ${headline.title}` };
}

// GET /reviews/:id/rounds — open, follow, settle and close peer-review rounds (author, owner).
export default async function RoundsPage({ params }: Props) {
  const { id, list, headline, mechanisms } = await load((await params).id);
  return <RoundsManager reviewId={id} title={headline.title} mechanisms={mechanisms} fallback={list} />;
}

import type { Metadata } from 'next';
import { cache } from 'react';
import { RoundsManager } from '@/components/rounds/RoundsManager';
import { roundsManagerAccess } from '@/lib/auth/page-gates';
import { listRounds, reviewHeadline } from '@/lib/rounds/queries';
import { getWorkbench } from '@/lib/reviews/queries';

type Props = { params: Promise<{ id: string }> };

/** The author's and owner's round page; the layout has already sent anyone else away or to 404. */
const load = cache(async (rawId: string) => {
  const { id, actor, access } = await roundsManagerAccess(rawId);
  const [list, headline, workbench] = await Promise.all([
    listRounds(id, actor, access),
    reviewHeadline(id),
    getWorkbench(id),
  ]);
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

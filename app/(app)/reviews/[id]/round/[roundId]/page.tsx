import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { cache } from 'react';
import { ScorecardPage } from '@/components/rounds/ScorecardPage';
import { requirePageActor } from '@/lib/auth/current';
import { decide } from '@/lib/auth/policy';
import { roundAccess } from '@/lib/rounds/access';
import { scorecardView } from '@/lib/rounds/queries';

type Props = { params: Promise<{ id: string; roundId: string }> };

/** The blind scorecard when the signed-in person is invited to this round; anyone else gets 404. */
const load = cache(async (rawId: string, rawRound: string) => {
  const id = Number(rawId);
  const roundId = Number(rawRound);
  if (!Number.isInteger(id) || id <= 0 || !Number.isInteger(roundId) || roundId <= 0) notFound();
  const actor = await requirePageActor(`/reviews/${rawId}/round/${rawRound}`);
  const access = await roundAccess(id, roundId, actor.userId).catch(() => null);
  if (!access || decide(actor, 'review.round.scorecard', access) !== 'allow') notFound();
  return scorecardView(access.round, actor, access);
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { id, roundId } = await params;
  const view = await load(id, roundId);
  return { title: `Scorecard: ${view.review.title}` };
}

// GET /reviews/:id/round/:roundId — the invited reviewer's blind scorecard.
export default async function ScorecardRoute({ params }: Props) {
  const { id, roundId } = await params;
  return <ScorecardPage view={await load(id, roundId)} />;
}

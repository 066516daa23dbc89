import type { Metadata } from 'next';
import { cache } from 'react';
import { ScorecardPage } from '@/components/rounds/ScorecardPage';
import { invitedRound } from '@/lib/auth/page-gates';
import { scorecardView } from '@/lib/rounds/queries';

type Props = { params: Promise<{ id: string; roundId: string }> };

/** The blind scorecard; the layout has already answered 404 to anyone not invited to this round. */
const load = cache(async (rawId: string, rawRound: string) => {
  const { actor, access } = await invitedRound(rawId, rawRound);
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

'use client';

import Link from 'next/link';
import { LocalTime } from '@/components/review/LocalTime';
import { useRounds } from '@/lib/swr/use-rounds';

/**
 * For the workbench header: while a round is open, says so and links to where the reader acts
 * (the author and owner to the round page, an invited reviewer to their scorecard); otherwise a
 * quiet link to the review's peer review. Renders nothing for people with no part in it.
 */
export function RoundStatusBadge({ reviewId }: { reviewId: number }) {
  const { data } = useRounds(reviewId);
  if (!data) return null;
  const open = data.rounds.find((r) => r.status === 'open');
  const manages = Boolean(data.candidates);
  if (open) {
    const href = manages ? `/reviews/${reviewId}/rounds` : `/reviews/${reviewId}/round/${open.id}`;
    return (
      <p className="border-rope-200 bg-rope-50 text-rope-800 rounded-md border px-3 py-2 text-sm">
        In peer review until <LocalTime iso={open.dueAt} />: the text, mechanisms and appraisals are frozen.{' '}
        <Link href={href} className="font-semibold underline">
          {manages ? 'See the round' : open.you.submitted ? 'See the agreement' : 'Open your scorecard'}
        </Link>
      </p>
    );
  }
  if (!manages && data.rounds.length === 0) return null;
  return (
    <Link
      href={manages ? `/reviews/${reviewId}/rounds` : `/reviews/${reviewId}/round/${data.rounds[0].id}`}
      className="prose-link text-sm"
    >
      Peer review{data.rounds.length ? ` (${data.rounds.length} round${data.rounds.length === 1 ? '' : 's'})` : ''}
    </Link>
  );
}

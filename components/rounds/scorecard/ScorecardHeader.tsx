'use client';

import { LocalTime } from '@/components/review/LocalTime';
import { Badge } from '@/components/ui/Badge';
import type { ScorecardViewDTO } from '@/lib/rounds/types';
import { populationSummary, protocolSummary } from '@/components/review/summaries';

/** What is being reviewed, by whom, until when, and where the reviewer stands. */
export function ScorecardHeader({
  round,
  review,
  submittedAt,
}: {
  round: ScorecardViewDTO['round'];
  review: ScorecardViewDTO['review'];
  submittedAt: string | null;
}) {
  return (
    <header className="space-y-3">
      <p className="flex flex-wrap items-center gap-2 text-sm">
        <Badge tone="brand">Peer review</Badge>
        {round.status === 'closed' ? <Badge>Round closed</Badge> : <Badge tone="accent">Open</Badge>}
        {submittedAt ? <Badge tone="success">You submitted</Badge> : <Badge>Blind until you submit</Badge>}
        <span className="text-ink-muted">
          by {review.authorName} · due <LocalTime iso={round.dueAt} />
        </span>
      </p>
      <h1 className="text-2xl font-semibold sm:text-3xl">{review.title}</h1>
      <blockquote className="border-rope-500 border-l-4 pl-4">
        <p className="font-display text-lg leading-snug">“{review.claim}”</p>
        {review.claimSource && <footer className="text-ink-muted mt-1 text-sm">{review.claimSource}</footer>}
      </blockquote>
      <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="font-semibold">Protocol</dt>
        <dd className="text-ink-muted">{protocolSummary(review.protocol)}</dd>
        <dt className="font-semibold">For</dt>
        <dd className="text-ink-muted">{populationSummary(review.population)}</dd>
      </dl>
      {round.note && (
        <p className="border-line bg-paper-sunken rounded-md border px-4 py-3 text-sm">
          <span className="font-semibold">Note from {round.openedByName}:</span> {round.note}
        </p>
      )}
      {!submittedAt && round.status === 'open' && (
        <p className="text-ink-muted max-w-measure text-sm">
          Score each mechanism from the author’s analysis and evidence below. The engine’s probabilities and the other
          reviewers’ scores stay hidden until you submit. Your draft saves itself as you go.
        </p>
      )}
    </header>
  );
}

'use client';

import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import type { ReviewDTO } from '@/lib/reviews/types';
import { REVIEW_STATUS_LABEL } from './labels';
import { populationSummary, protocolSummary } from './summaries';

/** The claim under review, as the top of the workbench. */
export function ReviewHeader({
  review,
  canEdit,
  onEdit,
  onDelete,
}: {
  review: ReviewDTO;
  canEdit: boolean;
  onEdit: () => void;
  onDelete: () => void;
}) {
  return (
    <header className="space-y-4 pb-6">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="min-w-0 space-y-2">
          <p className="flex flex-wrap items-center gap-2 text-sm">
            <Badge tone="brand">{REVIEW_STATUS_LABEL[review.status]}</Badge>
            <span className="text-ink-muted">by {review.authorName}</span>
          </p>
          <h1 className="text-2xl font-semibold sm:text-3xl">{review.title}</h1>
        </div>
        {canEdit && (
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" size="sm" onClick={onEdit}>
              Edit claim and protocol
            </Button>
            <Button variant="danger" size="sm" onClick={onDelete}>
              Delete review
            </Button>
          </div>
        )}
      </div>
      <blockquote className="border-rope-500 border-l-4 pl-4">
        <p className="font-display text-lg leading-snug" data-testid="claim">
          “{review.claim}”
        </p>
        <footer className="text-ink-muted mt-1 text-sm">
          {review.claimSource}
          {review.claimUrl && (
            <>
              {' · '}
              <a href={review.claimUrl} className="prose-link" target="_blank" rel="noreferrer noopener">
                source
                <span className="sr-only"> (opens in a new tab)</span>
              </a>
            </>
          )}
        </footer>
      </blockquote>
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="font-semibold">Protocol</dt>
        <dd className="text-ink-muted">{protocolSummary(review.protocol)}</dd>
        <dt className="font-semibold">For</dt>
        <dd className="text-ink-muted">{populationSummary(review.population)}</dd>
        {review.tags.length > 0 && (
          <>
            <dt className="font-semibold">Tags</dt>
            <dd className="flex flex-wrap gap-1.5">
              {review.tags.map((tag) => (
                <Badge key={tag}>{tag}</Badge>
              ))}
            </dd>
          </>
        )}
      </dl>
    </header>
  );
}

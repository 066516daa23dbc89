'use client';

import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import type { LoadUnit, ReviewDTO } from '@/lib/reviews/types';
import { EFFORT_LABEL, percent, REVIEW_STATUS_LABEL, TRAINING_STATUS_LABEL } from './labels';

const LOAD_UNIT_SHORT: Record<LoadUnit, string> = {
  'percent-max': '% of max',
  'percent-1rm': '%1RM',
  'percent-mvc': '%MVC',
  'percent-bodyweight': '% body weight',
  'kg-added': 'kg added',
};

/** The protocol in one line a coach reads at a glance. */
export function protocolSummary(review: ReviewDTO): string {
  const p = review.protocol;
  const parts: string[] = [];
  if (p.exercise) parts.push(p.exercise);
  if (p.loadValue !== null && p.loadUnit) parts.push(`${p.loadValue} ${LOAD_UNIT_SHORT[p.loadUnit]}`);
  // Body-weight loads only mean something next to the athlete's maximum: show the conversion.
  if (p.intensity !== null && (p.loadUnit === 'percent-bodyweight' || p.loadUnit === 'kg-added')) {
    parts.push(`≈ ${percent(p.intensity)} of max`);
  }
  const dose = [
    p.secondsPerSet !== null ? `${p.secondsPerSet} s` : null,
    p.setsPerSession !== null ? `× ${p.setsPerSession} set${p.setsPerSession === 1 ? '' : 's'}` : null,
    p.sessionsPerDay !== null ? `× ${p.sessionsPerDay} session${p.sessionsPerDay === 1 ? '' : 's'}/day` : null,
    p.daysPerWeek !== null ? `· ${p.daysPerWeek} days/week` : null,
  ]
    .filter(Boolean)
    .join(' ');
  if (dose) parts.push(dose);
  if (p.minHoursBetween !== null) parts.push(`≥ ${p.minHoursBetween} h apart`);
  if (p.weeks !== null) parts.push(`${p.weeks} weeks`);
  if (p.effort) parts.push(`effort ${EFFORT_LABEL[p.effort].toLowerCase()}`);
  return parts.join(' · ') || 'No protocol recorded';
}

export function populationSummary(review: ReviewDTO): string {
  const { status, injured } = review.population;
  return `${status ? TRAINING_STATUS_LABEL[status] : 'Any training status'}, ${injured ? 'injured' : 'healthy'}`;
}

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
        <dd className="text-ink-muted">{protocolSummary(review)}</dd>
        <dt className="font-semibold">For</dt>
        <dd className="text-ink-muted">{populationSummary(review)}</dd>
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

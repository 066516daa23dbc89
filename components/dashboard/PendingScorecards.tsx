import Link from 'next/link';
import { Badge } from '@/components/ui/Badge';
import type { PendingScorecardDTO } from '@/lib/rounds/types';

const DUE = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', timeZone: 'UTC' });

/**
 * The scorecards a reviewer still owes, first on their dashboard so nobody depends on finding
 * the invitation mail. Nothing is shown when none are open.
 */
export function PendingScorecards({ items }: { items: PendingScorecardDTO[] }) {
  if (!items.length) return null;
  return (
    <section aria-labelledby="scorecards-heading" className="mb-10 space-y-4">
      <h2 id="scorecards-heading" className="text-xl font-semibold">
        Scorecards waiting for you
      </h2>
      <ul className="grid gap-3 md:grid-cols-2">
        {items.map((item) => (
          <li key={item.roundId}>
            <Link
              href={`/reviews/${item.reviewId}/round/${item.roundId}`}
              className="border-line bg-paper-raised shadow-card hover:border-brand flex h-full flex-col gap-2 rounded-lg border p-4"
            >
              <span className="font-semibold break-words">{item.title}</span>
              <span className="flex flex-wrap items-center gap-2 text-sm">
                <Badge tone={item.overdue ? 'danger' : 'warning'}>
                  {item.overdue ? 'Overdue' : 'Due'} {DUE.format(new Date(item.dueAt))}
                </Badge>
                <span className="text-ink-muted">
                  {item.draftSaved ? 'Draft saved: finish and submit' : 'Not started: score it blind'}
                </span>
              </span>
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}

import Link from 'next/link';
import { EmptyState } from '@/components/ui/EmptyState';
import { VerdictChip } from '@/components/verdict/VerdictChip';
import { longDate } from '@/components/verdict-page/labels';
import type { VerdictListItemDTO } from '@/lib/publishing/types';
import { VerdictPageLink } from '@/components/verdict-page/VerdictPageLink';

/** The dashboard of someone who reads verdicts rather than writes reviews: the latest few. */
export function LatestVerdicts({ verdicts }: { verdicts: readonly VerdictListItemDTO[] }) {
  return (
    <section aria-labelledby="latest-verdicts" className="mt-10 space-y-4" data-testid="latest-verdicts">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="latest-verdicts" className="text-xl font-semibold">
          Latest verdicts
        </h2>
        <Link href="/verdicts" className="text-brand text-sm font-semibold hover:underline">
          All verdicts and search
        </Link>
      </div>
      {verdicts.length === 0 ? (
        <EmptyState title="No verdicts yet">When your team publishes a verdict, it appears here.</EmptyState>
      ) : (
        <ul className="space-y-3">
          {verdicts.map((v) => (
            <li key={v.slug} className="border-line bg-paper-raised rounded-lg border p-4">
              <div className="flex flex-wrap items-center gap-2">
                <VerdictChip verdict={v.verdict} label={v.verdictLabel} />
                <span className="text-ink-muted text-sm">
                  {v.teamName} · {longDate(v.publishedAt)}
                </span>
              </div>
              <h3 className="mt-2 font-semibold">
                <VerdictPageLink slug={v.slug} className="hover:underline">
                  {v.claim}
                </VerdictPageLink>
              </h3>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

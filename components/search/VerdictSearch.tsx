'use client';

import { useDeferredValue, useId, useState } from 'react';
import { Badge } from '@/components/ui/Badge';
import { EmptyState } from '@/components/ui/EmptyState';
import { VerdictChip } from '@/components/verdict/VerdictChip';
import { longDate } from '@/components/verdict-page/labels';
import type { VerdictListItemDTO } from '@/lib/publishing/types';
import { errorMessage } from '@/lib/swr/fetcher';
import { useVerdictSearch } from '@/lib/swr/use-search';
import { Highlight } from './Highlight';
import { VerdictPageLink } from '@/components/verdict-page/VerdictPageLink';

/**
 * The athlete's list of published verdicts, newest first, with a fuzzy search box (GET
 * /api/verdicts?q=): a misspelled or half-remembered word still finds a verdict.
 */
export function VerdictSearch({
  initial,
  teamId,
  emptyText = 'When your team publishes a verdict, it appears here.',
}: {
  initial: VerdictListItemDTO[];
  teamId?: number;
  /** What an empty list says before any search. */
  emptyText?: string;
}) {
  const [q, setQ] = useState('');
  const deferred = useDeferredValue(q.trim());
  const id = useId();
  const { data, error, isLoading } = useVerdictSearch(deferred, teamId);
  const items = deferred ? (data?.verdicts ?? []) : initial;
  return (
    <div className="space-y-4">
      <form role="search" onSubmit={(e) => e.preventDefault()} className="space-y-1.5">
        <label htmlFor={id} className="block text-sm font-semibold">
          Search the verdicts
        </label>
        <input
          id={id}
          type="search"
          name="q"
          value={q}
          onChange={(e) => setQ(e.target.value)}
          placeholder="a word you remember, e.g. tendons"
          className="border-line-strong bg-paper-raised focus:border-brand block w-full rounded-md border px-3 py-2.5 text-base"
          autoComplete="off"
        />
      </form>
      <div aria-live="polite" className="text-ink-muted text-sm">
        {deferred && !isLoading && !error && `${items.length} ${items.length === 1 ? 'verdict' : 'verdicts'} found`}
        {error && <span className="text-danger-700">{errorMessage(error)}</span>}
      </div>
      {items.length === 0 ? (
        <EmptyState title={deferred ? 'Nothing matches that' : 'No verdicts yet'}>
          {deferred ? 'Try another word, or fewer words.' : emptyText}
        </EmptyState>
      ) : (
        <ul className="space-y-3">
          {items.map((v) => (
            <li key={v.slug} className="border-line bg-paper-raised rounded-lg border p-4">
              <div className="flex flex-wrap items-center gap-2">
                <VerdictChip verdict={v.verdict} label={v.verdictLabel} />
                {v.withdrawn && <Badge tone="danger">Withdrawn</Badge>}
                <span className="text-ink-muted text-sm">
                  {v.teamName} · version {v.version} · {longDate(v.publishedAt)}
                  {v.visibility === 'team' ? ' · team only' : ''}
                </span>
              </div>
              <h2 className="mt-2 text-lg font-semibold">
                <VerdictPageLink slug={v.slug} className="hover:underline">
                  <Highlight text={v.claim} field="item.claim" matches={v.matches} />
                </VerdictPageLink>
              </h2>
              {v.title !== v.claim && (
                <p className="text-ink-muted text-sm">
                  <Highlight text={v.title} field="item.title" matches={v.matches} />
                </p>
              )}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

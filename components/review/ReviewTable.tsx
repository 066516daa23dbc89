'use client';

import Fuse from 'fuse.js';
import { VerdictChip } from '@/components/verdict/VerdictChip';
import Link from 'next/link';
import { useMemo, useState } from 'react';
import { Badge } from '@/components/ui/Badge';
import { LinkButton } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { SelectField, TextField } from '@/components/ui/Field';
import { Skeleton } from '@/components/ui/Skeleton';
import { REVIEW_STATUSES, type ReviewSummaryDTO } from '@/lib/reviews/types';
import { VERDICT_KEYS } from '@/lib/scoring/constants';
import { useReviews } from '@/lib/swr/use-reviews';
import { REVIEW_STATUS_LABEL, VERDICT_KEY_LABEL } from './labels';
import { LocalTime } from './LocalTime';

type SortKey = 'title' | 'status' | 'verdict' | 'updatedAt' | 'authorName';
const COLUMNS: { key: SortKey; label: string }[] = [
  { key: 'title', label: 'Title' },
  { key: 'status', label: 'Status' },
  { key: 'verdict', label: 'Verdict' },
  { key: 'updatedAt', label: 'Updated' },
  { key: 'authorName', label: 'Author' },
];

// Sort in the order the workflow runs, not alphabetically.
const statusRank = (s: ReviewSummaryDTO) => REVIEW_STATUSES.indexOf(s.status);
const verdictRank = (s: ReviewSummaryDTO) => (s.verdict ? VERDICT_KEYS.indexOf(s.verdict) : -1);

/**
 * A team's reviews: sortable by every column (click a heading; again to reverse) and filtered
 * in the browser by text (fuzzy over title, claim, tags and author), status and verdict.
 */
export function ReviewTable({
  teamId,
  initial,
  canCreate,
}: {
  teamId: number;
  initial?: ReviewSummaryDTO[];
  canCreate: boolean;
}) {
  const { data, error, isLoading, mutate } = useReviews(teamId, initial ? { reviews: initial } : undefined);
  const [q, setQ] = useState('');
  const [status, setStatus] = useState('');
  const [verdict, setVerdict] = useState('');
  const [sort, setSort] = useState<{ key: SortKey; desc: boolean }>({ key: 'updatedAt', desc: true });

  const reviews = useMemo(() => data?.reviews ?? [], [data]);
  const fuse = useMemo(
    () => new Fuse(reviews, { keys: ['title', 'claim', 'tags', 'authorName'], threshold: 0.35, ignoreLocation: true }),
    [reviews],
  );
  const rows = useMemo(() => {
    let list = q.trim() ? fuse.search(q.trim()).map((r) => r.item) : [...reviews];
    if (status) list = list.filter((r) => r.status === status);
    if (verdict) list = list.filter((r) => (verdict === 'none' ? r.verdict === null : r.verdict === verdict));
    const dir = sort.desc ? -1 : 1;
    const value = (r: ReviewSummaryDTO): string | number =>
      sort.key === 'status'
        ? statusRank(r)
        : sort.key === 'verdict'
          ? verdictRank(r)
          : sort.key === 'updatedAt'
            ? Date.parse(r.updatedAt)
            : r[sort.key].toLowerCase();
    return list.sort((a, b) => {
      const x = value(a);
      const y = value(b);
      return (x < y ? -1 : x > y ? 1 : 0) * dir || a.id - b.id;
    });
  }, [fuse, q, reviews, status, verdict, sort]);

  const toggle = (key: SortKey) =>
    setSort((s) => (s.key === key ? { key, desc: !s.desc } : { key, desc: key === 'updatedAt' }));

  if (error && !data) {
    return (
      <div role="alert" className="border-danger-100 bg-danger-50 text-danger-800 rounded-md border px-4 py-3 text-sm">
        The reviews could not be loaded: {error.message}{' '}
        <button type="button" className="font-semibold underline" onClick={() => void mutate()}>
          Try again
        </button>
      </div>
    );
  }
  if (isLoading && !data) {
    return (
      <div className="space-y-2" aria-busy="true" aria-label="Loading reviews">
        {[0, 1, 2].map((i) => (
          <Skeleton key={i} className="h-12 w-full" />
        ))}
      </div>
    );
  }
  if (reviews.length === 0) {
    return (
      <EmptyState
        title="No reviews yet"
        action={
          canCreate ? (
            <LinkButton href="/reviews/new" variant="primary">
              New review
            </LinkButton>
          ) : undefined
        }
      >
        A review starts from a claim you saw: one sentence, who made it, and the protocol it prescribes.
      </EmptyState>
    );
  }

  return (
    <div className="space-y-4">
      <div className="grid gap-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_minmax(0,1fr)]">
        <TextField
          label="Search"
          name="q"
          type="search"
          optional
          value={q}
          onChange={(e) => setQ(e.target.value)}
          placeholder="Title, claim, tag or author"
        />
        <SelectField
          label="Status"
          name="status"
          optional
          value={status}
          onChange={(e) => setStatus(e.target.value)}
          options={[
            { value: '', label: 'Any status' },
            ...REVIEW_STATUSES.map((s) => ({ value: s, label: REVIEW_STATUS_LABEL[s] })),
          ]}
        />
        <SelectField
          label="Verdict"
          name="verdict"
          optional
          value={verdict}
          onChange={(e) => setVerdict(e.target.value)}
          options={[
            { value: '', label: 'Any verdict' },
            ...VERDICT_KEYS.map((v) => ({ value: v, label: VERDICT_KEY_LABEL[v] })),
            { value: 'none', label: 'No verdict yet' },
          ]}
        />
      </div>
      <p className="text-ink-muted text-sm" role="status" aria-live="polite">
        {rows.length === reviews.length
          ? `${reviews.length} reviews`
          : `${rows.length} of ${reviews.length} reviews match`}
      </p>
      {/* Phones: one card per review and a sort menu instead of column headings. */}
      <div className="space-y-3 md:hidden">
        <label className="flex items-center gap-2 text-sm">
          <span className="font-semibold">Sort by</span>
          <select
            value={`${sort.key}:${sort.desc ? 'desc' : 'asc'}`}
            onChange={(e) => {
              const [key, dir] = e.target.value.split(':');
              setSort({ key: key as SortKey, desc: dir === 'desc' });
            }}
            className="border-line-strong bg-paper-raised min-h-10 flex-1 rounded-md border px-2"
          >
            {COLUMNS.flatMap((c) => [
              <option key={`${c.key}:asc`} value={`${c.key}:asc`}>
                {c.label} ↑
              </option>,
              <option key={`${c.key}:desc`} value={`${c.key}:desc`}>
                {c.label} ↓
              </option>,
            ])}
          </select>
        </label>
        <ul className="space-y-3" data-testid="review-list">
          {rows.map((r) => (
            <li key={r.id} className="border-line bg-paper-raised shadow-card space-y-2 rounded-lg border px-4 py-3">
              <Link href={`/reviews/${r.id}`} className="text-brand block font-semibold hover:underline">
                {r.title}
              </Link>
              <p className="text-ink-muted line-clamp-2 text-sm">{r.claim}</p>
              <p className="flex flex-wrap items-center gap-2 text-xs">
                <Badge tone="brand">{REVIEW_STATUS_LABEL[r.status]}</Badge>
                {r.verdict && (
                  <VerdictChip verdict={r.verdict} label={r.verdictLabel ?? VERDICT_KEY_LABEL[r.verdict]} />
                )}
              </p>
              <p className="text-ink-muted text-xs">
                <LocalTime iso={r.updatedAt} /> · {r.authorName}
              </p>
            </li>
          ))}
        </ul>
        {rows.length === 0 && <p className="text-ink-muted text-sm">No review matches these filters.</p>}
      </div>
      <div className="border-line bg-paper-raised shadow-card relative hidden overflow-x-auto rounded-lg border md:block">
        <table className="w-full min-w-[44rem] text-sm" data-testid="review-table">
          <caption className="sr-only">The team’s reviews; column headings sort the table.</caption>
          <thead>
            <tr className="border-line-strong bg-paper-sunken/60 border-b text-left">
              {COLUMNS.map((c) => (
                <th
                  key={c.key}
                  scope="col"
                  aria-sort={sort.key === c.key ? (sort.desc ? 'descending' : 'ascending') : 'none'}
                  className="px-4 py-1"
                >
                  <button
                    type="button"
                    onClick={() => toggle(c.key)}
                    className="text-ink-muted hover:text-ink inline-flex min-h-10 items-center gap-1 text-xs font-semibold tracking-wide uppercase"
                  >
                    {c.label}
                    <span aria-hidden="true" className="text-ink-muted w-3">
                      {sort.key === c.key ? (sort.desc ? '↓' : '↑') : '↕'}
                    </span>
                  </button>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} className="border-line hover:bg-paper-sunken/40 border-b align-top last:border-b-0">
                <th scope="row" className="max-w-md px-4 py-3 text-left font-normal">
                  <Link href={`/reviews/${r.id}`} className="text-brand font-semibold hover:underline">
                    {r.title}
                  </Link>
                  <span className="text-ink-muted mt-0.5 block truncate text-xs" title={r.claim}>
                    {r.claim}
                  </span>
                </th>
                <td className="px-4 py-3">{REVIEW_STATUS_LABEL[r.status]}</td>
                <td className="px-4 py-3">
                  {r.verdict ? (
                    <VerdictChip verdict={r.verdict} label={r.verdictLabel ?? VERDICT_KEY_LABEL[r.verdict]} />
                  ) : (
                    <span className="text-ink-muted">—</span>
                  )}
                </td>
                <td className="text-ink-muted px-4 py-3 whitespace-nowrap">
                  <LocalTime iso={r.updatedAt} />
                </td>
                <td className="px-4 py-3">{r.authorName}</td>
              </tr>
            ))}
            {rows.length === 0 && (
              <tr>
                <td colSpan={5} className="text-ink-muted px-4 py-8 text-center">
                  No review matches these filters.{' '}
                  <button
                    type="button"
                    className="text-brand font-semibold underline"
                    onClick={() => {
                      setQ('');
                      setStatus('');
                      setVerdict('');
                    }}
                  >
                    Clear the filters
                  </button>
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}

'use client';

import Link from 'next/link';
import { useEffect, useState } from 'react';
import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { SelectField, TextField } from '@/components/ui/Field';
import { Skeleton } from '@/components/ui/Skeleton';
import { DESIGN_LABEL, percent, TRAINING_STATUS_LABEL } from '@/components/review/labels';
import { LocalTime } from '@/components/review/LocalTime';
import { STUDY_DESIGNS } from '@/lib/reviews/types';
import { useStudies } from '@/lib/swr/use-studies';
import { NoticeBadge } from './NoticeBadge';
import { SuggestedDesign } from './SuggestedDesign';

type SortField = 'citation' | 'year' | 'design' | 'added';
const COLUMNS: { key: SortField | null; label: string; className?: string }[] = [
  { key: 'citation', label: 'Reference' },
  { key: 'year', label: 'Year' },
  { key: 'design', label: 'Design' },
  { key: null, label: 'Population' },
  { key: null, label: 'n', className: 'text-right' },
  { key: null, label: 'Data' },
  { key: 'added', label: 'Added' },
];
const PAGE_SIZES = [10, 25, 50, 100];

/**
 * The team's evidence library. Search, filter and sort run on the server (the library can hold
 * thousands of entries); the table pages through the results. The state lives in the address
 * bar too, so a filtered view can be shared and survives a reload.
 */
export function StudyTable({
  teamId,
  initial,
}: {
  teamId: number;
  initial?: { q?: string; design?: string; tag?: string; sort?: string; page?: number; pageSize?: number };
}) {
  const [text, setText] = useState(initial?.q ?? '');
  const [q, setQ] = useState(initial?.q ?? '');
  const [design, setDesign] = useState(initial?.design ?? '');
  const [tag, setTag] = useState(initial?.tag ?? '');
  const [sort, setSort] = useState(initial?.sort ?? '-added');
  const [page, setPage] = useState(initial?.page ?? 1);
  const [pageSize, setPageSize] = useState(initial?.pageSize ?? 25);

  // Search as the coach types, without a request per keystroke.
  useEffect(() => {
    if (text.trim() === q) return;
    const timer = setTimeout(() => {
      setQ(text.trim());
      setPage(1);
    }, 300);
    return () => clearTimeout(timer);
  }, [text, q]);

  useEffect(() => {
    const params = new URLSearchParams(window.location.search);
    const setParam = (key: string, value: string, fallback: string) =>
      value && value !== fallback ? params.set(key, value) : params.delete(key);
    setParam('q', q, '');
    setParam('design', design, '');
    setParam('tag', tag, '');
    setParam('sort', sort, '-added');
    setParam('page', String(page), '1');
    setParam('pageSize', String(pageSize), '25');
    const search = params.toString();
    window.history.replaceState(null, '', `${window.location.pathname}${search ? `?${search}` : ''}`);
  }, [q, design, tag, sort, page, pageSize]);

  const { data, error, isLoading, isValidating, mutate } = useStudies({
    teamId,
    q: q || undefined,
    design: design || undefined,
    tag: tag || undefined,
    sort,
    page,
    pageSize,
  });

  const sortField = sort.replace(/^-/, '') as SortField;
  const descending = sort.startsWith('-');
  const toggle = (key: SortField) => {
    setSort(sortField === key ? (descending ? key : `-${key}`) : key === 'added' || key === 'year' ? `-${key}` : key);
    setPage(1);
  };

  const total = data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const filtered = Boolean(q || design || tag);
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);

  return (
    <section aria-labelledby="library-table-title" className="space-y-4">
      <h2 id="library-table-title" className="sr-only">
        Studies
      </h2>
      <div className="grid gap-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_minmax(0,1fr)]">
        <TextField
          label="Search"
          name="q"
          type="search"
          optional
          value={text}
          onChange={(e) => setText(e.target.value)}
          placeholder="Author, title, journal or DOI"
        />
        <SelectField
          label="Design"
          name="design"
          optional
          value={design}
          onChange={(e) => {
            setDesign(e.target.value);
            setPage(1);
          }}
          options={[
            { value: '', label: 'Any design' },
            ...STUDY_DESIGNS.map((d) => ({ value: d, label: DESIGN_LABEL[d] })),
          ]}
        />
        <TextField
          label="Tag"
          name="tag"
          optional
          value={tag}
          onChange={(e) => {
            setTag(e.target.value.trim().toLowerCase());
            setPage(1);
          }}
          placeholder="e.g. tendon"
        />
      </div>

      {error && !data ? (
        <div
          role="alert"
          className="border-danger-100 bg-danger-50 text-danger-800 rounded-md border px-4 py-3 text-sm"
        >
          The library could not be loaded: {error.message}{' '}
          <button type="button" className="font-semibold underline" onClick={() => void mutate()}>
            Try again
          </button>
        </div>
      ) : isLoading && !data ? (
        <div className="space-y-2" aria-busy="true" aria-label="Loading studies">
          {[0, 1, 2, 3].map((i) => (
            <Skeleton key={i} className="h-12 w-full" />
          ))}
        </div>
      ) : total === 0 && !filtered ? (
        <EmptyState title="The library is empty">
          Add studies above by DOI, BibTeX, RIS or CSL-JSON; every review of the team can then link and appraise them.
        </EmptyState>
      ) : (
        <>
          <p className="text-ink-muted text-sm" role="status" aria-live="polite">
            {total === 0 ? 'No study matches these filters.' : `Studies ${first}–${last} of ${total}`}
            {isValidating && data ? ' · updating…' : ''}
          </p>
          {/* Phones: one card per study and a sort menu instead of column headings. */}
          <div className="space-y-3 md:hidden">
            <label className="flex items-center gap-2 text-sm">
              <span className="font-semibold">Sort by</span>
              <select
                value={sort}
                onChange={(e) => {
                  setSort(e.target.value);
                  setPage(1);
                }}
                className="border-line-strong bg-paper-raised min-h-10 flex-1 rounded-md border px-2"
              >
                <option value="-added">Newest first</option>
                <option value="added">Oldest first</option>
                <option value="citation">Reference A–Z</option>
                <option value="-citation">Reference Z–A</option>
                <option value="-year">Year, newest</option>
                <option value="year">Year, oldest</option>
                <option value="design">Design</option>
              </select>
            </label>
            <ul className="space-y-3" data-testid="study-list">
              {(data?.studies ?? []).map((s) => (
                <li
                  key={s.id}
                  className="border-line bg-paper-raised shadow-card space-y-1 rounded-lg border px-4 py-3 text-sm"
                >
                  <Link href={`/library/${s.id}`} className="text-brand font-semibold hover:underline">
                    {s.citation}
                  </Link>
                  <p className="text-ink">{s.title}</p>
                  <NoticeBadge notice={s.notice} />
                  <p className="text-ink-muted text-xs">
                    {[
                      s.design ? DESIGN_LABEL[s.design] : 'design not recorded',
                      s.population ? TRAINING_STATUS_LABEL[s.population] : null,
                      s.n ? `n = ${s.n}` : null,
                      s.effect ? 'effect size' : null,
                      s.hasPdf ? 'PDF' : null,
                    ]
                      .filter(Boolean)
                      .join(' · ')}
                  </p>
                  {!s.design && s.suggestedDesign && <SuggestedDesign studyId={s.id} design={s.suggestedDesign} />}
                </li>
              ))}
            </ul>
          </div>
          <div className="border-line bg-paper-raised shadow-card relative hidden overflow-x-auto rounded-lg border md:block">
            <table className="w-full min-w-[48rem] text-sm" data-testid="study-table">
              <caption className="sr-only">
                The team’s studies; sortable column headings sort the whole library.
              </caption>
              <thead>
                <tr className="border-line-strong bg-paper-sunken/60 border-b text-left">
                  {COLUMNS.map((c) => (
                    <th
                      key={c.label}
                      scope="col"
                      aria-sort={c.key && sortField === c.key ? (descending ? 'descending' : 'ascending') : undefined}
                      className={`text-ink-muted px-4 py-1 text-xs font-semibold tracking-wide uppercase ${c.className ?? ''}`}
                    >
                      {c.key ? (
                        <button
                          type="button"
                          onClick={() => toggle(c.key!)}
                          className="hover:text-ink inline-flex min-h-10 items-center gap-1 uppercase"
                        >
                          {c.label}
                          <span aria-hidden="true" className="text-ink-muted w-3">
                            {sortField === c.key ? (descending ? '↓' : '↑') : '↕'}
                          </span>
                        </button>
                      ) : (
                        <span className="inline-flex min-h-10 items-center">{c.label}</span>
                      )}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {(data?.studies ?? []).map((s) => (
                  <tr
                    key={s.id}
                    className="border-line hover:bg-paper-sunken/40 border-b align-top last:border-b-0"
                    data-testid="study-row"
                  >
                    <th scope="row" className="max-w-md px-4 py-3 text-left font-normal">
                      <Link href={`/library/${s.id}`} className="text-brand font-semibold hover:underline">
                        {s.citation}
                      </Link>
                      <span className="text-ink mt-0.5 block">{s.title}</span>
                      {s.notice && (
                        <span className="mt-1 block">
                          <NoticeBadge notice={s.notice} />
                        </span>
                      )}
                      {s.journal && <span className="text-ink-muted block text-xs italic">{s.journal}</span>}
                      {s.tags.length > 0 && (
                        <span className="mt-1 flex flex-wrap gap-1">
                          {s.tags.map((t) => (
                            <Badge key={t}>{t}</Badge>
                          ))}
                        </span>
                      )}
                    </th>
                    <td className="px-4 py-3 tabular-nums">{s.year ?? '—'}</td>
                    <td className="px-4 py-3">
                      {s.design ? (
                        DESIGN_LABEL[s.design]
                      ) : s.suggestedDesign ? (
                        <SuggestedDesign studyId={s.id} design={s.suggestedDesign} />
                      ) : (
                        <span className="text-ink-muted">not recorded</span>
                      )}
                    </td>
                    <td className="px-4 py-3">
                      {s.population ? TRAINING_STATUS_LABEL[s.population] : '—'}
                      {s.injured && <span className="text-ink-muted block text-xs">injured</span>}
                    </td>
                    <td className="px-4 py-3 text-right tabular-nums">{s.n ?? '—'}</td>
                    <td className="text-ink-muted px-4 py-3 text-xs">
                      {[
                        s.effect ? 'effect size' : null,
                        s.intensity != null ? `${percent(s.intensity)} of max` : null,
                        s.hasPdf ? 'PDF' : null,
                      ]
                        .filter(Boolean)
                        .join(' · ') || '—'}
                    </td>
                    <td className="text-ink-muted px-4 py-3 whitespace-nowrap">
                      <LocalTime iso={s.createdAt} dateOnly />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3">
            <div className="flex items-center gap-2">
              <Button
                variant="secondary"
                size="sm"
                disabled={page <= 1}
                onClick={() => setPage((p) => Math.max(1, p - 1))}
              >
                Previous page
              </Button>
              <span className="text-ink-muted text-sm tabular-nums">
                Page {page} of {pages}
              </span>
              <Button
                variant="secondary"
                size="sm"
                disabled={page >= pages}
                onClick={() => setPage((p) => Math.min(pages, p + 1))}
              >
                Next page
              </Button>
            </div>
            <label className="flex items-center gap-2 text-sm">
              Per page
              <select
                value={pageSize}
                onChange={(e) => {
                  setPageSize(Number(e.target.value));
                  setPage(1);
                }}
                className="border-line-strong bg-paper-raised min-h-9 rounded-md border px-2"
              >
                {PAGE_SIZES.map((n) => (
                  <option key={n} value={n}>
                    {n}
                  </option>
                ))}
              </select>
            </label>
          </nav>
        </>
      )}
    </section>
  );
}

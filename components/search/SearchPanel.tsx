'use client';

import Link from 'next/link';
import { useDeferredValue, useId, useState } from 'react';
import { Badge } from '@/components/ui/Badge';
import { EmptyState } from '@/components/ui/EmptyState';
import { SelectField } from '@/components/ui/Field';
import { errorMessage } from '@/lib/swr/fetcher';
import { useSearch } from '@/lib/swr/use-search';
import { Highlight } from './Highlight';

const KIND_LABEL = { review: 'Review', mechanism: 'Mechanism', study: 'Study' } as const;
const any = { value: '', label: 'Any' };

/**
 * Fuzzy search over the team's reviews, mechanisms and studies (GET /api/search), with filters
 * and the matched words marked. The filters go to the server, which applies them to the ranked
 * results of the team's kept index.
 */
export function SearchPanel({ teams, tags }: { teams: { id: number; name: string }[]; tags: string[] }) {
  const [q, setQ] = useState('');
  const [teamId, setTeamId] = useState(String(teams[0]?.id ?? ''));
  const [kind, setKind] = useState('');
  const [status, setStatus] = useState('');
  const [verdict, setVerdict] = useState('');
  const [tag, setTag] = useState('');
  const deferred = useDeferredValue(q.trim());
  const inputId = useId();
  const params = new URLSearchParams({ q: deferred, teamId });
  for (const [k, v] of Object.entries({ kind, status, verdict, tag })) if (v) params.set(k, v);
  const { data, error, isLoading } = useSearch(deferred ? params : null);
  const results = data?.results ?? [];
  return (
    <div className="space-y-6">
      <form role="search" onSubmit={(e) => e.preventDefault()} className="space-y-4">
        <div className="space-y-1.5">
          <label htmlFor={inputId} className="block text-sm font-semibold">
            Search reviews, mechanisms and studies
          </label>
          <input
            id={inputId}
            type="search"
            value={q}
            onChange={(e) => setQ(e.target.value)}
            placeholder="e.g. tendon stiffness, cold plunge, Holt 2024"
            autoComplete="off"
            className="border-line-strong bg-paper-raised focus:border-brand block w-full rounded-md border px-3 py-2.5 text-base"
          />
        </div>
        <div className="grid gap-3 sm:grid-cols-5">
          {teams.length > 1 && (
            <SelectField
              label="Team"
              value={teamId}
              onChange={(e) => setTeamId(e.target.value)}
              options={teams.map((t) => ({ value: String(t.id), label: t.name }))}
            />
          )}
          <SelectField
            label="Kind"
            optional
            value={kind}
            onChange={(e) => setKind(e.target.value)}
            options={[any, ...Object.entries(KIND_LABEL).map(([value, label]) => ({ value, label }))]}
          />
          <SelectField
            label="Status"
            optional
            value={status}
            onChange={(e) => setStatus(e.target.value)}
            options={[
              any,
              ...['draft', 'in-review', 'approved', 'published', 'archived'].map((s) => ({ value: s, label: s })),
            ]}
          />
          <SelectField
            label="Verdict"
            optional
            value={verdict}
            onChange={(e) => setVerdict(e.target.value)}
            options={[
              any,
              ...['supported', 'not-supported', 'uncertain', 'insufficient', 'other-reasons'].map((s) => ({
                value: s,
                label: s,
              })),
            ]}
          />
          <SelectField
            label="Tag"
            optional
            value={tag}
            onChange={(e) => setTag(e.target.value)}
            options={[any, ...tags.map((t) => ({ value: t, label: t }))]}
          />
        </div>
      </form>
      <p aria-live="polite" className="text-ink-muted text-sm">
        {deferred && !isLoading && !error && `${results.length} ${results.length === 1 ? 'result' : 'results'}`}
        {error && <span className="text-danger-700">{errorMessage(error)}</span>}
      </p>
      {deferred && results.length === 0 && !isLoading && !error ? (
        <EmptyState title="Nothing matches">Try fewer words, or clear a filter.</EmptyState>
      ) : (
        <ul className="space-y-3">
          {results.map((r) => (
            <li key={`${r.kind}:${r.id}`} className="border-line bg-paper-raised rounded-lg border p-4">
              <div className="flex flex-wrap items-center gap-2">
                <Badge>{KIND_LABEL[r.kind]}</Badge>
                {r.status && <Badge tone="brand">{r.status}</Badge>}
              </div>
              <h2 className="mt-2 font-semibold">
                <Link href={r.href} className="hover:underline">
                  <Highlight text={r.title} field={r.kind === 'mechanism' ? 'name' : 'title'} matches={r.matches} />
                </Link>
              </h2>
              <p className="text-ink-muted text-sm">
                <Highlight text={r.detail} field={r.kind === 'review' ? 'claim' : 'citation'} matches={r.matches} />
              </p>
              {r.tags && r.tags.length > 0 && <p className="text-ink-muted mt-1 text-xs">Tags: {r.tags.join(', ')}</p>}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

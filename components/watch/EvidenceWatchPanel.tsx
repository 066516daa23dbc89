'use client';

import Link from 'next/link';
import { useState } from 'react';
import useSWR from 'swr';
import { NoticeBadge } from '@/components/library/NoticeBadge';
import { Button } from '@/components/ui/Button';
import { Card, CardBody, CardHeader } from '@/components/ui/Card';
import { apiFetch, errorMessage, fetcher } from '@/lib/swr/fetcher';
import type { EvidenceFlagDTO, WatchRunDTO } from '@/lib/watch/types';
import { VerdictPageLink } from '@/components/verdict-page/VerdictPageLink';

type Status = { run: WatchRunDTO | null; flags: EvidenceFlagDTO[] };

const WHEN = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });

/**
 * The evidence watch on the library page: when it last ran and what it found, a button for
 * owners and coaches to run it now (with progress while it asks the registry), and every
 * published verdict flagged "evidence changed" with its reason and the dry run without the study.
 */
export function EvidenceWatchPanel({ teamId, canRun }: { teamId: number; canRun: boolean }) {
  const key = `/api/teams/${teamId}/evidence-watch`;
  const { data, error, mutate } = useSWR<Status>(key, fetcher, {
    // Poll while a run is going, so the progress bar moves.
    refreshInterval: (latest) => (latest?.run?.status === 'running' ? 1000 : 0),
  });
  const [starting, setStarting] = useState(false);
  const [message, setMessage] = useState('');
  const run = data?.run ?? null;
  const running = run?.status === 'running';

  async function start() {
    setStarting(true);
    setMessage('');
    try {
      const res = await apiFetch<{ run: WatchRunDTO }>(key, { method: 'POST' });
      await mutate({ run: res.run, flags: data?.flags ?? [] }, { revalidate: true });
    } catch (e) {
      setMessage(errorMessage(e));
    } finally {
      setStarting(false);
    }
  }

  return (
    <Card aria-labelledby="watch-heading" data-testid="evidence-watch">
      <CardHeader
        id="watch-heading"
        title="Evidence watch"
        description="Every day the library’s DOIs are checked for retractions, corrections and expressions of concern; verdicts citing an affected study are flagged."
        actions={
          canRun && (
            <Button size="sm" onClick={start} disabled={starting || running}>
              {running ? 'Checking…' : 'Check the library now'}
            </Button>
          )
        }
      />
      <CardBody className="space-y-4 text-sm">
        {error && <p role="alert">{errorMessage(error)}</p>}
        {message && <p role="alert">{message}</p>}
        <RunLine run={run} flagged={(data?.flags.length ?? 0) > 0} />
        {data && (
          <section aria-labelledby="flags-heading" className="space-y-2">
            <h3 id="flags-heading" className="font-semibold">
              Published verdicts whose evidence changed
            </h3>
            {data.flags.length === 0 ? (
              <p className="text-ink-muted">None: no published verdict cites a study under a notice.</p>
            ) : (
              <ul className="space-y-3" data-testid="evidence-flags">
                {data.flags.map((f) => (
                  <li key={f.id} className="border-danger-100 rounded-md border px-3 py-2">
                    <p className="flex flex-wrap items-center gap-2">
                      <span className="bg-danger-50 text-danger-800 rounded px-1.5 text-xs font-semibold uppercase">
                        Evidence changed
                      </span>
                      <VerdictPageLink slug={f.slug} className="text-brand font-semibold hover:underline">
                        {f.title}
                      </VerdictPageLink>
                      <span className="text-ink-muted">version {f.versionNumber}</span>
                    </p>
                    <p className="mt-1">
                      <Link href={`/library/${f.study.id}`} className="prose-link">
                        {f.study.citation}
                      </Link>{' '}
                      <NoticeBadge notice={f.notice} />
                    </p>
                    <p className="text-ink-muted mt-1">
                      {f.reason}
                      {f.dryRunText && ` ${f.dryRunText}`}
                    </p>
                  </li>
                ))}
              </ul>
            )}
          </section>
        )}
      </CardBody>
    </Card>
  );
}

function RunLine({ run, flagged }: { run: WatchRunDTO | null; flagged: boolean }) {
  if (!run) {
    // Flags without a run on record come with the data (the demo seed writes them as a run would):
    // say so rather than that nothing was ever checked.
    return (
      <p className="text-ink-muted">
        {flagged
          ? 'No run of the watch is on record for this team yet; the flags below were recorded before.'
          : 'The watch has not run for this team yet.'}
      </p>
    );
  }
  if (run.status === 'running') {
    return (
      <div className="space-y-1" aria-live="polite">
        <p>
          Asking the registry… {run.checked} of {run.total} DOIs
        </p>
        <progress className="w-full" max={Math.max(run.total, 1)} value={run.checked} aria-label="Watch progress" />
      </div>
    );
  }
  const when = WHEN.format(new Date(run.finishedAt ?? run.startedAt));
  if (run.status === 'failed') {
    return (
      <p role="status" className="text-danger-800">
        The last run ({when} UTC) stopped and changed nothing: {run.error}
      </p>
    );
  }
  const s = run.summary;
  return (
    <p role="status" data-testid="watch-summary">
      Last run {when} UTC: {s?.asked ?? 0} DOIs checked with the registry ({s?.cached ?? 0} recently checked),{' '}
      {s?.newNotices.length ?? 0} new notice{s?.newNotices.length === 1 ? '' : 's'}, {s?.flagged.length ?? 0} verdict
      {s?.flagged.length === 1 ? '' : 's'} flagged, {s?.suggestions ?? 0} new-evidence offer
      {s?.suggestions === 1 ? '' : 's'}.
    </p>
  );
}

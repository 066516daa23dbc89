'use client';

import Link from 'next/link';
import { useId, useRef, useState, type FormEvent } from 'react';
import { useSWRConfig } from 'swr';
import { Button } from '@/components/ui/Button';
import { cn } from '@/components/ui/cn';
import { DESIGN_LABEL } from '@/components/review/labels';
import { Spinner } from '@/components/ui/Spinner';
import { TextAreaField } from '@/components/ui/Field';
import type { ImportResultDTO } from '@/lib/reviews/types';
import { apiFetch, apiStream, errorMessage } from '@/lib/swr/fetcher';
import { isStudiesKey } from '@/lib/swr/keys';
import { MAX_SOURCE_CHARS } from '@/lib/validation/studies';
import { SuggestedDesign } from './SuggestedDesign';

interface Progress {
  phase: 'sending' | 'reading' | 'looking-up' | 'saving' | 'done';
  done: number;
  total: number;
}

const PHASE_LABEL: Record<Progress['phase'], string> = {
  sending: 'Sending…',
  reading: 'Reading the entries…',
  'looking-up': 'Looking up DOIs…',
  saving: 'Adding to the library…',
  done: 'Done',
};

const STATUS_LABEL: Record<ImportResultDTO['status'], string> = {
  added: 'Added',
  duplicate: 'Already in the library',
  failed: 'Failed',
};
const STATUS_MARK: Record<ImportResultDTO['status'], string> = { added: '✓', duplicate: '=', failed: '✗' };
const SHOWN = 200;
const ACCEPTED = ['.bib', '.ris', '.json'];

/**
 * Bring studies into the library: paste DOIs, BibTeX, RIS or CSL-JSON, or pick a .bib / .ris /
 * .json file. The server streams its progress (reading, DOI look-ups, saving) as JSON lines, so a
 * 2,000-entry file shows a moving bar instead of a long spinner; every entry then gets a line
 * saying whether it was added, was already there, or failed and why. The pasted text is only
 * cleared once the server has answered for every entry, so a dropped connection loses nothing.
 */
export function AddStudies({ teamId }: { teamId: number }) {
  const { mutate } = useSWRConfig();
  const [source, setSource] = useState('');
  const [file, setFile] = useState<File | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [progress, setProgress] = useState<Progress | null>(null);
  const [results, setResults] = useState<ImportResultDTO[] | null>(null);
  const [filter, setFilter] = useState<'all' | ImportResultDTO['status']>('all');
  const [running, setRunning] = useState(false);
  const [confirmed, setConfirmed] = useState<ReadonlySet<number>>(new Set());
  const [confirming, setConfirming] = useState<{ done: number; total: number } | null>(null);
  const abort = useRef<AbortController | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const fileId = useId();
  const progressId = useId();

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setError(null);
    setResults(null);
    setFilter('all');
    setConfirmed(new Set());
    if (file) {
      if (!ACCEPTED.some((ext) => file.name.toLowerCase().endsWith(ext))) {
        setError(`“${file.name}” is not a .bib, .ris or .json file.`);
        return;
      }
      if (file.size > MAX_SOURCE_CHARS) {
        setError(
          `That file is ${(file.size / 1_000_000).toFixed(1)} MB; the limit is 10 MB. Split it and add the parts one by one.`,
        );
        return;
      }
    } else if (!source.trim()) {
      setError('Paste a DOI, BibTeX, RIS or CSL-JSON, or choose a file.');
      return;
    } else if (source.length > MAX_SOURCE_CHARS) {
      setError('The pasted text is over 10 MB; add it in parts.');
      return;
    }

    const controller = new AbortController();
    abort.current = controller;
    setRunning(true);
    setProgress({ phase: 'sending', done: 0, total: 0 });
    let finished = false;
    try {
      const init: RequestInit & { json?: unknown } = { method: 'POST', signal: controller.signal };
      let url = '/api/studies';
      if (file) {
        const form = new FormData();
        form.set('teamId', String(teamId));
        form.set('file', file);
        init.body = form;
        url = '/api/studies/import';
      } else {
        init.json = { teamId, source };
      }
      await apiStream(url, init, (line) => {
        if (line.type === 'progress') {
          setProgress({ phase: line.phase as Progress['phase'], done: Number(line.done), total: Number(line.total) });
        } else if (line.type === 'result') {
          const list = (line.results as ImportResultDTO[]) ?? [];
          setResults(list);
          setProgress((p) => ({ phase: 'done', done: list.length, total: Math.max(list.length, p?.total ?? 0) }));
          finished = true;
        } else if (line.type === 'error') {
          setError(String(line.error ?? 'The import failed.'));
        }
      });
      if (finished) {
        setSource('');
        setFile(null);
        if (fileInput.current) fileInput.current.value = '';
      } else if (!controller.signal.aborted) {
        setError(
          (e) =>
            e ??
            'The server stopped before it answered for every entry. Your text is still here; send it again (entries already added will show as already in the library).',
        );
      }
    } catch (e) {
      if (controller.signal.aborted)
        setError('Stopped. Entries the server had already saved stay in the library; your text is still here.');
      else setError(errorMessage(e));
    } finally {
      setRunning(false);
      abort.current = null;
      void mutate(isStudiesKey);
    }
  };

  const counts = { added: 0, duplicate: 0, failed: 0 };
  for (const r of results ?? []) counts[r.status] += 1;
  const visible = (results ?? []).filter((r) => filter === 'all' || r.status === filter);
  const markConfirmed = (studyId: number) => setConfirmed((set) => new Set(set).add(studyId));
  // One suggestion per study (a study matched twice is offered once).
  const suggestions = [
    ...new Map(
      (results ?? []).flatMap((r) =>
        r.studyId && r.suggestedDesign && !confirmed.has(r.studyId) ? [[r.studyId, r.suggestedDesign] as const] : [],
      ),
    ),
  ];

  /** Confirms every open suggestion, a few requests at a time, each through the study's own PATCH. */
  const confirmAll = async () => {
    const queue = [...suggestions];
    setConfirming({ done: 0, total: queue.length });
    setError(null);
    let done = 0;
    const worker = async () => {
      for (let next = queue.shift(); next; next = queue.shift()) {
        const [studyId, design] = next;
        await apiFetch(`/api/studies/${studyId}`, { method: 'PATCH', json: { design } });
        markConfirmed(studyId);
        done += 1;
        setConfirming({ done, total: suggestions.length });
      }
    };
    try {
      await Promise.all([worker(), worker(), worker()]);
    } catch (e) {
      setError(`Some designs were not confirmed: ${errorMessage(e)}`);
    } finally {
      setConfirming(null);
      void mutate(isStudiesKey);
    }
  };

  return (
    <section aria-labelledby="add-studies-title" className="border-line bg-paper-raised shadow-card rounded-lg border">
      <div className="border-line border-b px-5 py-4">
        <h2 id="add-studies-title" className="text-lg font-semibold">
          Add studies
        </h2>
        <p className="text-ink-muted text-sm">
          Paste one or more DOIs (one per line), BibTeX, RIS or CSL-JSON — or choose a .bib, .ris or .json file. Studies
          already in the library (same DOI) are not added twice.
        </p>
      </div>
      <form onSubmit={submit} className="space-y-4 px-5 py-4" noValidate>
        <TextAreaField
          label="DOIs or references"
          name="source"
          rows={6}
          className="font-mono text-sm"
          placeholder={'10.5555/granite.2024.001\n\n@article{holt2024, …}'}
          value={source}
          onChange={(e) => setSource(e.target.value)}
          disabled={running || Boolean(file)}
        />
        <div className="space-y-1.5">
          <label htmlFor={fileId} className="block text-sm font-semibold">
            Or a library file <span className="text-ink-muted font-normal">(optional)</span>
          </label>
          <input
            ref={fileInput}
            id={fileId}
            name="file"
            type="file"
            accept=".bib,.ris,.json,application/json,application/x-bibtex"
            disabled={running}
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            className="file:border-line-strong file:bg-paper-raised file:text-ink hover:file:bg-chalk-50 block w-full text-sm file:mr-3 file:min-h-10 file:rounded-md file:border file:px-3 file:font-semibold"
          />
          {file && (
            <p className="text-ink-muted text-sm">
              {file.name} ({Math.max(1, Math.round(file.size / 1000))} kB) will be added instead of the pasted text.{' '}
              <button
                type="button"
                className="text-brand font-semibold underline"
                onClick={() => {
                  setFile(null);
                  if (fileInput.current) fileInput.current.value = '';
                }}
              >
                Remove file
              </button>
            </p>
          )}
        </div>
        {error && (
          <p
            role="alert"
            className="border-danger-100 bg-danger-50 text-danger-800 rounded-md border px-3 py-2 text-sm"
          >
            {error}
          </p>
        )}
        <div className="flex flex-wrap items-center gap-2">
          <Button type="submit" disabled={running} aria-busy={running || undefined}>
            {running && <Spinner />}
            Add studies
          </Button>
          {running && (
            <Button variant="secondary" onClick={() => abort.current?.abort()}>
              Stop
            </Button>
          )}
        </div>

        {progress && (
          <div className="space-y-1.5" data-testid="import-progress">
            <div className="flex justify-between text-sm">
              <span className="font-semibold">{PHASE_LABEL[progress.phase]}</span>
              <span className="text-ink-muted tabular-nums" aria-live="polite">
                {progress.total > 0
                  ? `${progress.done.toLocaleString()} of ${progress.total.toLocaleString()} entries`
                  : ''}
              </span>
            </div>
            {/* Without a total yet the bar is indeterminate (no value), shown as a moving stripe. */}
            <div
              id={progressId}
              role="progressbar"
              aria-label="Import progress"
              aria-valuemin={0}
              aria-valuemax={progress.total || undefined}
              aria-valuenow={progress.total > 0 ? progress.done : undefined}
              className="bg-chalk-200 relative h-2 overflow-hidden rounded-full"
            >
              {progress.total > 0 ? (
                <div
                  className="bg-granite-600 h-full rounded-full transition-[width] duration-200"
                  style={{ width: `${Math.min(100, (progress.done / progress.total) * 100)}%` }}
                />
              ) : (
                <div className="bg-granite-400 absolute inset-y-0 left-0 w-1/3 animate-pulse rounded-full" />
              )}
            </div>
          </div>
        )}
      </form>

      {results && (
        <div className="border-line space-y-3 border-t px-5 py-4" data-testid="import-results">
          <p className="text-sm font-semibold" role="status">
            {counts.added} added · {counts.duplicate} already in the library · {counts.failed} failed
          </p>
          {suggestions.length > 0 && (
            <div className="bg-chalk-50 border-line flex flex-wrap items-center gap-2 rounded-md border px-3 py-2 text-sm">
              <span>
                {suggestions.length === 1
                  ? '1 study names its design in the title or keywords.'
                  : `${suggestions.length.toLocaleString()} studies name their design in the title or keywords.`}{' '}
                Check the suggestions below, then confirm them so these studies can be appraised.
              </span>
              <Button variant="secondary" onClick={confirmAll} disabled={confirming !== null}>
                {confirming
                  ? `Confirming ${confirming.done.toLocaleString()} of ${confirming.total.toLocaleString()}…`
                  : `Confirm all ${suggestions.length.toLocaleString()}`}
              </Button>
            </div>
          )}
          <div role="group" aria-label="Show" className="flex flex-wrap gap-1">
            {(['all', 'added', 'duplicate', 'failed'] as const).map((f) => (
              <button
                key={f}
                type="button"
                aria-pressed={filter === f}
                onClick={() => setFilter(f)}
                className={cn(
                  'min-h-9 rounded-full border px-3 text-sm',
                  filter === f
                    ? 'border-brand bg-brand text-white'
                    : 'border-line-strong bg-paper-raised hover:border-brand',
                )}
              >
                {f === 'all' ? `All (${results.length})` : `${STATUS_LABEL[f]} (${counts[f]})`}
              </button>
            ))}
          </div>
          <ol className="divide-line border-line divide-y rounded-md border text-sm">
            {visible.slice(0, SHOWN).map((r) => (
              <li key={r.index} className="flex gap-3 px-3 py-2" data-testid="import-result" data-status={r.status}>
                <span
                  aria-hidden="true"
                  className={cn(
                    'w-4 shrink-0 font-bold',
                    r.status === 'added' && 'text-success-700',
                    r.status === 'duplicate' && 'text-ink-muted',
                    r.status === 'failed' && 'text-danger-700',
                  )}
                >
                  {STATUS_MARK[r.status]}
                </span>
                <span className="min-w-0">
                  <span className="font-semibold">{STATUS_LABEL[r.status]}</span>
                  {' — '}
                  {r.studyId ? (
                    <Link href={`/library/${r.studyId}`} className="text-brand hover:underline">
                      {r.title ?? `Entry ${r.index + 1}`}
                    </Link>
                  ) : (
                    <span>{r.title ?? `Entry ${r.index + 1}`}</span>
                  )}
                  {r.reason && <span className="text-ink-muted block">{r.reason}</span>}
                  {r.studyId && r.suggestedDesign && (
                    <span className="mt-1 block">
                      {confirmed.has(r.studyId) ? (
                        <span className="text-success-700">Design set: {DESIGN_LABEL[r.suggestedDesign]} ✓</span>
                      ) : (
                        <SuggestedDesign studyId={r.studyId} design={r.suggestedDesign} onConfirmed={markConfirmed} />
                      )}
                    </span>
                  )}
                </span>
              </li>
            ))}
          </ol>
          {visible.length > SHOWN && (
            <p className="text-ink-muted text-sm">
              The first {SHOWN} of {visible.length} are shown; filter by “Failed” to see what needs attention.
            </p>
          )}
        </div>
      )}
    </section>
  );
}

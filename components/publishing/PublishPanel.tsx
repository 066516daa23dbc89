'use client';

import { useId, useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/Button';
import type { PublishResultDTO, Visibility } from '@/lib/publishing/types';
import { ApiError, apiFetch, errorMessage } from '@/lib/swr/fetcher';
import { keys } from '@/lib/swr/keys';
import { usePublication } from '@/lib/swr/use-publication';
import { VerdictPageLink } from '@/components/verdict-page/VerdictPageLink';

interface PublicationState {
  publication: {
    slug: string;
    visibility: Visibility;
    latestNumber: number;
    lastPublishedAt: string;
    withdrawn: { at: string; reason: string } | null;
  } | null;
  /** The policy's answer for this reader: may they publish or withdraw this review? */
  mayPublish?: boolean;
}

/**
 * The workbench's publish box: visibility, the "what changed" note (required from version 2),
 * publish, and withdraw with a reason. The server decides who may publish and from which
 * status; its refusal is shown as it is worded.
 */
export function PublishPanel({ reviewId }: { reviewId: number }) {
  const key = keys.publication(reviewId);
  const { data, mutate } = usePublication<PublicationState>(reviewId);
  const pub = data?.publication ?? null;
  const [visibility, setVisibility] = useState<Visibility>('team');
  const [note, setNote] = useState('');
  const [reason, setReason] = useState('');
  const [message, setMessage] = useState('');
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [busy, setBusy] = useState(false);
  const noteId = useId();
  const reasonId = useId();
  const next = (pub?.latestNumber ?? 0) + 1;
  const mayPublish = data?.mayPublish === true;

  async function run(fn: () => Promise<string>) {
    setBusy(true);
    setMessage('');
    setErrors({});
    try {
      setMessage(await fn());
      await mutate();
    } catch (error) {
      setMessage(errorMessage(error));
      if (error instanceof ApiError) setErrors(error.fieldErrors());
    } finally {
      setBusy(false);
    }
  }

  const publish = (e: FormEvent) => {
    e.preventDefault();
    // Publishing for everyone cannot be taken back quietly: readers may already have copied it.
    if (
      visibility === 'public' &&
      !window.confirm(
        'Publish this verdict for anyone with the link? It can be withdrawn later, but the page says it was withdrawn and why.',
      )
    )
      return;
    void run(async () => {
      const res = await apiFetch<PublishResultDTO>(key, {
        method: 'POST',
        json: { visibility, changeNote: note || undefined },
      });
      setNote('');
      return `Published version ${res.version.number}; ${res.notified} ${res.notified === 1 ? 'follower' : 'followers'} e-mailed.`;
    });
  };
  const withdraw = (e: FormEvent) => {
    e.preventDefault();
    void run(async () => {
      await apiFetch(`/api/reviews/${reviewId}/unpublish`, { method: 'POST', json: { reason } });
      setReason('');
      return 'Withdrawn. Readers now see that it was withdrawn, and why.';
    });
  };

  return (
    <section aria-labelledby="publish-heading" className="border-line bg-paper-raised space-y-4 rounded-lg border p-4">
      <h2 id="publish-heading" className="text-lg font-semibold">
        Publish for athletes
      </h2>
      {pub && (
        <p className="text-sm">
          Version {pub.latestNumber} is published{pub.withdrawn ? ' but withdrawn' : ''}:{' '}
          <VerdictPageLink slug={pub.slug} className="prose-link">
            /v/{pub.slug}
          </VerdictPageLink>
        </p>
      )}
      {data && !mayPublish && (
        <p className="text-ink-muted text-sm" data-testid="publish-not-allowed">
          Only the team’s owner can publish or withdraw verdicts here; an owner can let coaches publish in the team’s
          publishing settings.
        </p>
      )}
      {mayPublish && (
        <form onSubmit={publish} className="space-y-3">
          <fieldset className="space-y-1">
            <legend className="text-sm font-semibold">Who may read it</legend>
            {(['team', 'public'] as const).map((v) => (
              <label key={v} className="flex items-center gap-2">
                <input
                  type="radio"
                  name="visibility"
                  value={v}
                  checked={visibility === v}
                  onChange={() => setVisibility(v)}
                />
                {v === 'team' ? 'Team members only (athletes included)' : 'Anyone with the link (public)'}
              </label>
            ))}
          </fieldset>
          {next > 1 && (
            <div className="space-y-1">
              <label htmlFor={noteId} className="block text-sm font-semibold">
                What changed since version {next - 1}
              </label>
              <textarea
                id={noteId}
                name="changeNote"
                value={note}
                onChange={(e) => setNote(e.target.value)}
                rows={3}
                required
                aria-invalid={errors.changeNote ? true : undefined}
                aria-describedby={errors.changeNote ? `${noteId}-error` : undefined}
                className="border-line-strong block w-full rounded-md border px-3 py-2"
              />
              {errors.changeNote && (
                <p id={`${noteId}-error`} className="text-danger-700 text-sm">
                  {errors.changeNote.join(' ')}
                </p>
              )}
            </div>
          )}
          <Button type="submit" variant="primary" disabled={busy}>
            {next === 1 ? 'Publish verdict' : `Publish version ${next}`}
          </Button>
        </form>
      )}
      {mayPublish && pub && !pub.withdrawn && (
        <form onSubmit={withdraw} className="border-line space-y-2 border-t pt-3">
          <label htmlFor={reasonId} className="block text-sm font-semibold">
            Withdraw: why (readers see this)
          </label>
          <textarea
            id={reasonId}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            rows={2}
            required
            minLength={10}
            className="border-line-strong block w-full rounded-md border px-3 py-2"
          />
          <Button type="submit" variant="danger" disabled={busy}>
            Withdraw verdict
          </Button>
        </form>
      )}
      <p aria-live="polite" className="text-sm">
        {message}
      </p>
    </section>
  );
}

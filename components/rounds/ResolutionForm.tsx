'use client';

import { useId, useState } from 'react';
import { Button } from '@/components/ui/Button';
import {
  RESOLUTION_KINDS,
  RESOLUTION_LABEL,
  type MechanismAgreementDTO,
  type ResolutionKind,
} from '@/lib/rounds/types';
import { apiFetch, ApiError, errorMessage } from '@/lib/swr/fetcher';

/**
 * The author's settlement of one flagged mechanism. Changes to the prior, appraisals or
 * magnitude are made in the workbench after the round closes (the review is frozen while it is
 * open); keeping it as it is needs a written reason.
 */
export function ResolutionForm({
  reviewId,
  roundId,
  row,
  onSaved,
}: {
  reviewId: number;
  roundId: number;
  row: MechanismAgreementDTO;
  onSaved: () => void;
}) {
  const id = useId();
  const [editing, setEditing] = useState(!row.resolution);
  const [kind, setKind] = useState<ResolutionKind>((row.resolution?.kind as ResolutionKind) ?? 'keep');
  const [reason, setReason] = useState(row.resolution?.reason ?? '');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  if (!editing)
    return (
      <Button variant="ghost" size="sm" className="mt-2" onClick={() => setEditing(true)}>
        Change the resolution
      </Button>
    );

  const save = async (event: React.FormEvent) => {
    event.preventDefault();
    setBusy(true);
    setError(null);
    try {
      await apiFetch(`/api/reviews/${reviewId}/rounds/${roundId}/resolutions`, {
        method: 'POST',
        json: { mechanismId: row.mechanismId, kind, reason },
      });
      setEditing(false);
      onSaved();
    } catch (e) {
      setError(e instanceof ApiError && e.issues.length ? e.issues.map((i) => i.message).join(' ') : errorMessage(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <form
      onSubmit={save}
      className="border-rope-200 bg-rope-50/60 mt-3 space-y-3 rounded-md border p-3"
      aria-label={`Resolve ${row.name}`}
    >
      <fieldset>
        <legend className="text-sm font-semibold">Resolution for “{row.name}”</legend>
        <div className="mt-2 flex flex-wrap gap-x-4 gap-y-2">
          {RESOLUTION_KINDS.map((k) => (
            <label key={k} className="flex min-h-9 items-center gap-2 text-sm">
              <input
                type="radio"
                name={`${id}-kind`}
                value={k}
                checked={kind === k}
                onChange={() => setKind(k)}
                className="accent-granite-700 size-4"
              />
              {RESOLUTION_LABEL[k]}
            </label>
          ))}
        </div>
      </fieldset>
      <div>
        <label htmlFor={`${id}-reason`} className="block text-sm font-semibold">
          {kind === 'keep' ? 'Why it stays as it is' : 'What will change, and why'}
        </label>
        <textarea
          id={`${id}-reason`}
          rows={2}
          value={reason}
          onChange={(e) => setReason(e.target.value)}
          className="border-line-strong bg-paper-raised mt-1 block w-full rounded-md border px-3 py-2"
          aria-describedby={error ? `${id}-error` : undefined}
        />
      </div>
      {error && (
        <p id={`${id}-error`} role="alert" className="text-danger-700 text-sm font-medium">
          {error}
        </p>
      )}
      <Button type="submit" size="sm" disabled={busy}>
        {busy ? 'Saving…' : 'Record resolution'}
      </Button>
    </form>
  );
}

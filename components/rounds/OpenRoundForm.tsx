'use client';

import { useId, useState } from 'react';
import { Button } from '@/components/ui/Button';
import { Card, CardBody, CardHeader } from '@/components/ui/Card';
import type { CandidateDTO } from '@/lib/rounds/types';
import { apiFetch, ApiError, errorMessage } from '@/lib/swr/fetcher';

/** The default due date: a week from now at 18:00, in the datetime-local format of the reader's zone. */
function defaultDue(): string {
  const d = new Date(Date.now() + 7 * 24 * 60 * 60 * 1000);
  d.setHours(18, 0, 0, 0);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** Opening a round: pick reviewers among the team's coaches and reviewers, a due date and an optional note. */
export function OpenRoundForm({
  reviewId,
  candidates,
  onOpened,
}: {
  reviewId: number;
  candidates: CandidateDTO[];
  onOpened: (mailFailures: string[]) => void;
}) {
  const id = useId();
  const [chosen, setChosen] = useState<number[]>([]);
  const [due, setDue] = useState(defaultDue);
  const [note, setNote] = useState('');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string[]>>({});

  const toggle = (userId: number) =>
    setChosen((list) => (list.includes(userId) ? list.filter((x) => x !== userId) : [...list, userId]));

  const open = async (event: React.FormEvent) => {
    event.preventDefault();
    setError(null);
    setFieldErrors({});
    const dueDate = new Date(due);
    if (!chosen.length) {
      setFieldErrors({ reviewerIds: ['Choose at least one reviewer.'] });
      return;
    }
    if (Number.isNaN(dueDate.getTime())) {
      setFieldErrors({ dueAt: ['Give the due date as a date and time.'] });
      return;
    }
    setBusy(true);
    try {
      const res = await apiFetch<{ mailFailures: string[] }>(`/api/reviews/${reviewId}/rounds`, {
        method: 'POST',
        json: { reviewerIds: chosen, dueAt: dueDate.toISOString(), note },
      });
      onOpened(res.mailFailures);
    } catch (e) {
      if (e instanceof ApiError) {
        const grouped: Record<string, string[]> = {};
        for (const issue of e.issues) (grouped[issue.path.split('.')[0] || 'form'] ??= []).push(issue.message);
        setFieldErrors(grouped);
      }
      setError(errorMessage(e));
    } finally {
      setBusy(false);
    }
  };

  if (!candidates.length) {
    return (
      <Card>
        <CardHeader title="Open a peer-review round" />
        <CardBody>
          <p className="text-ink-muted">
            Nobody in the team can review this yet: invite a coach or a reviewer on the Team page first.
          </p>
        </CardBody>
      </Card>
    );
  }

  return (
    <Card aria-labelledby={`${id}-title`}>
      <CardHeader
        id={`${id}-title`}
        title="Open a peer-review round"
        description="Each reviewer gets an e-mail with a link to a blind scorecard. The review is frozen until the round closes."
      />
      <CardBody>
        <form onSubmit={open} className="space-y-5" noValidate>
          <fieldset aria-describedby={fieldErrors.reviewerIds ? `${id}-reviewers-error` : undefined}>
            <legend className="mb-2 text-sm font-semibold">Reviewers</legend>
            <ul className="grid gap-2 sm:grid-cols-2">
              {candidates.map((c) => (
                <li key={c.userId}>
                  <label className="border-line-strong bg-paper-raised has-[:checked]:border-granite-700 has-[:checked]:bg-granite-50 flex min-h-11 cursor-pointer items-center gap-3 rounded-md border px-3 py-2">
                    <input
                      type="checkbox"
                      name="reviewerIds"
                      value={c.userId}
                      checked={chosen.includes(c.userId)}
                      onChange={() => toggle(c.userId)}
                      className="accent-granite-700 size-4"
                    />
                    <span>
                      <span className="block font-medium">{c.name}</span>
                      <span className="text-ink-muted block text-xs">
                        {c.role} · {c.email}
                      </span>
                    </span>
                  </label>
                </li>
              ))}
            </ul>
            {chosen.length === 1 && (
              <p className="text-warning-800 mt-1.5 text-sm" role="status" data-testid="one-reviewer-warning">
                With one reviewer there is no agreement to read: α and κ need at least two submitted scorecards.
              </p>
            )}
            {fieldErrors.reviewerIds && (
              <p id={`${id}-reviewers-error`} className="text-danger-700 mt-1.5 text-sm font-medium">
                {fieldErrors.reviewerIds.join(' ')}
              </p>
            )}
          </fieldset>
          <div className="grid gap-4 sm:grid-cols-[16rem_1fr]">
            <div>
              <label htmlFor={`${id}-due`} className="block text-sm font-semibold">
                Due
              </label>
              <input
                id={`${id}-due`}
                name="dueAt"
                type="datetime-local"
                value={due}
                onChange={(e) => setDue(e.target.value)}
                required
                aria-invalid={fieldErrors.dueAt ? true : undefined}
                aria-describedby={fieldErrors.dueAt ? `${id}-due-error` : undefined}
                className="border-line-strong bg-paper-raised mt-1 block w-full rounded-md border px-3 py-2"
              />
              {fieldErrors.dueAt && (
                <p id={`${id}-due-error`} className="text-danger-700 mt-1.5 text-sm font-medium">
                  {fieldErrors.dueAt.join(' ')}
                </p>
              )}
            </div>
            <div>
              <label htmlFor={`${id}-note`} className="block text-sm font-semibold">
                Note to the reviewers <span className="text-ink-muted font-normal">(optional)</span>
              </label>
              <textarea
                id={`${id}-note`}
                name="note"
                rows={2}
                value={note}
                onChange={(e) => setNote(e.target.value)}
                className="border-line-strong bg-paper-raised mt-1 block w-full rounded-md border px-3 py-2"
              />
            </div>
          </div>
          <div role="alert" aria-live="assertive">
            {error && (
              <p className="border-danger-100 bg-danger-50 text-danger-800 rounded-md border px-3 py-2.5 text-sm font-medium">
                {error}
              </p>
            )}
          </div>
          <Button type="submit" disabled={busy}>
            {busy ? 'Opening…' : 'Open round and send invitations'}
          </Button>
        </form>
      </CardBody>
    </Card>
  );
}

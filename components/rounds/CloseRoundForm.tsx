'use client';

import { useId, useState } from 'react';
import { Button } from '@/components/ui/Button';
import type { AgreementDTO, RoundDTO } from '@/lib/rounds/types';
import { apiFetch, errorMessage } from '@/lib/swr/fetcher';

/**
 * Closing: lists what still stands in the way, lets the author close without a reviewer who did
 * not submit (with a reason), and says what the review's status will become.
 */
export function CloseRoundForm({
  reviewId,
  round,
  agreement,
  onClosed,
}: {
  reviewId: number;
  round: RoundDTO;
  agreement: AgreementDTO | undefined;
  onClosed: (outcome: 'approved' | 'draft', mailFailures: string[]) => void;
}) {
  const id = useId();
  const waiting = round.invitations.filter((i) => !i.submittedAt);
  const [without, setWithout] = useState<Record<number, { on: boolean; reason: string }>>({});
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const standing = agreement?.signOffs.filter((s) => s.signOff === 'do-not-publish') ?? [];

  const close = async () => {
    // Closing settles the round for good: scorecards can no longer change and the review's status moves.
    if (
      !window.confirm('Close this round? Scorecards can no longer be submitted or changed, and this cannot be undone.')
    )
      return;
    setBusy(true);
    setError(null);
    try {
      const closedWithout = waiting
        .filter((i) => without[i.reviewerId]?.on)
        .map((i) => ({ reviewerId: i.reviewerId, reason: without[i.reviewerId].reason }));
      const res = await apiFetch<{ outcome: 'approved' | 'draft'; mailFailures: string[] }>(
        `/api/reviews/${reviewId}/rounds/${round.id}/close`,
        { method: 'POST', json: { closedWithout } },
      );
      onClosed(res.outcome, res.mailFailures);
    } catch (e) {
      setError(errorMessage(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <section
      aria-labelledby={`${id}-title`}
      className="border-line bg-paper-raised shadow-card space-y-4 rounded-lg border p-5"
    >
      <h2 id={`${id}-title`} className="text-xl font-semibold">
        Close the round
      </h2>
      {agreement && agreement.unresolvedFlags > 0 && (
        <p className="text-sm">
          <strong>{agreement.unresolvedFlags}</strong> flagged mechanism{agreement.unresolvedFlags === 1 ? '' : 's'}{' '}
          still need a resolution (above).
        </p>
      )}
      {waiting.length > 0 && (
        <fieldset className="space-y-3">
          <legend className="text-sm font-semibold">Reviewers who have not submitted</legend>
          {waiting.map((i) => {
            const state = without[i.reviewerId] ?? { on: false, reason: '' };
            return (
              <div key={i.reviewerId} className="space-y-2">
                <label className="flex min-h-9 items-center gap-2 text-sm">
                  <input
                    type="checkbox"
                    className="accent-granite-700 size-4"
                    checked={state.on}
                    onChange={(e) => setWithout((w) => ({ ...w, [i.reviewerId]: { ...state, on: e.target.checked } }))}
                  />
                  Close without {i.reviewerName}
                </label>
                {state.on && (
                  <div>
                    <label htmlFor={`${id}-reason-${i.reviewerId}`} className="block text-sm font-semibold">
                      Why close without {i.reviewerName}?
                    </label>
                    <input
                      id={`${id}-reason-${i.reviewerId}`}
                      value={state.reason}
                      onChange={(e) =>
                        setWithout((w) => ({ ...w, [i.reviewerId]: { ...state, reason: e.target.value } }))
                      }
                      className="border-line-strong bg-paper-raised mt-1 block w-full rounded-md border px-3 py-2"
                    />
                  </div>
                )}
              </div>
            );
          })}
        </fieldset>
      )}
      <p className="text-ink-muted text-sm">
        {standing.length
          ? `A “do not publish” sign-off stands (${standing.map((s) => s.reviewerName).join(', ')}): closing now returns the review to draft.`
          : 'No “do not publish” sign-off stands: closing now approves the review.'}
      </p>
      <div role="alert" aria-live="assertive">
        {error && (
          <p className="border-danger-100 bg-danger-50 text-danger-800 rounded-md border px-3 py-2.5 text-sm font-medium">
            {error}
          </p>
        )}
      </div>
      <Button onClick={close} disabled={busy}>
        {busy ? 'Closing…' : 'Close the round'}
      </Button>
    </section>
  );
}

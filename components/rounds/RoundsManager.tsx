'use client';

import dynamic from 'next/dynamic';
import { useState } from 'react';
import { useSWRConfig } from 'swr';
import { LocalTime } from '@/components/review/LocalTime';
import { Badge } from '@/components/ui/Badge';
import { LinkButton } from '@/components/ui/Button';
import type { RoundDTO } from '@/lib/rounds/types';
import { AgreementPanel } from './AgreementPanel';
import { CloseRoundForm } from './CloseRoundForm';
import { OpenRoundForm } from './OpenRoundForm';
import { ResolutionForm } from './ResolutionForm';
import { RoundAuditLog } from './RoundAuditLog';
import { agreementKey, commentsKey, useAgreement, useRounds, type RoundList } from '@/lib/swr/use-rounds';

// The threads come last on the page and fetch their own data: their code comes after.
const CommentThreads = dynamic(() => import('./CommentThreads').then((m) => m.CommentThreads), { ssr: false });

/**
 * The author's and owner's view of a review's peer review: open a round, watch who has
 * submitted, read the agreement, settle flagged mechanisms, discuss, close; the owner also sees
 * the audit log.
 */
export function RoundsManager({
  reviewId,
  title,
  mechanisms,
  fallback,
}: {
  reviewId: number;
  title: string;
  mechanisms: { id: number; name: string }[];
  fallback: RoundList;
}) {
  const { data, error, mutate } = useRounds(reviewId, fallback);
  const [notice, setNotice] = useState<string | null>(null);
  const rounds = data?.rounds ?? [];
  const openRound = rounds.find((r) => r.status === 'open');

  return (
    <div className="space-y-8">
      <header className="space-y-2">
        <p className="text-sm">
          <a href={`/reviews/${reviewId}`} className="prose-link">
            ← Back to the workbench
          </a>
        </p>
        <h1 className="text-2xl font-semibold sm:text-3xl">Peer review: {title}</h1>
        <p className="text-ink-muted max-w-measure">
          Colleagues score every mechanism blind; the flagged disagreements are settled here before the round closes.
        </p>
      </header>
      <div role="status" aria-live="polite">
        {notice && (
          <p className="border-success-100 bg-success-50 text-success-800 flex items-center justify-between gap-2 rounded-md border px-4 py-2.5 text-sm">
            {notice}
            <button type="button" className="font-semibold underline" onClick={() => setNotice(null)}>
              Dismiss
            </button>
          </p>
        )}
      </div>
      {error && (
        <p role="alert" className="text-danger-700">
          The rounds could not be loaded: {error.message}
        </p>
      )}

      {!openRound && data?.candidates && (
        <OpenRoundForm
          reviewId={reviewId}
          candidates={data.candidates}
          onOpened={(failures) => {
            setNotice(
              failures.length
                ? `Round opened. The invitation to ${failures.join(', ')} could not be sent; tell them directly.`
                : 'Round opened and invitations sent. The review is frozen until the round closes.',
            );
            void mutate();
          }}
        />
      )}

      {rounds.length === 0 && <p className="text-ink-muted">No round yet.</p>}
      {rounds.map((round) => (
        <RoundSection
          key={round.id}
          reviewId={reviewId}
          round={round}
          mechanisms={mechanisms}
          onChanged={() => void mutate()}
          onNotice={setNotice}
        />
      ))}

      {data?.audit && <RoundAuditLog events={data.audit} />}
    </div>
  );
}

function RoundSection({
  reviewId,
  round,
  mechanisms,
  onChanged,
  onNotice,
}: {
  reviewId: number;
  round: RoundDTO;
  mechanisms: { id: number; name: string }[];
  onChanged: () => void;
  onNotice: (text: string) => void;
}) {
  const { mutate } = useSWRConfig();
  const agreement = useAgreement(reviewId, round.id);
  const open = round.status === 'open';
  const submitted = round.invitations.filter((i) => i.submittedAt).length;
  const refresh = () => {
    void agreement.mutate();
    onChanged();
  };

  return (
    <section id={`round-${round.id}`} aria-labelledby={`round-title-${round.id}`} className="space-y-6">
      <div className="border-line bg-paper-raised shadow-card space-y-3 rounded-lg border p-5">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h2 id={`round-title-${round.id}`} className="text-xl font-semibold">
            Round of <LocalTime iso={round.openedAt} dateOnly />
          </h2>
          <p className="flex flex-wrap gap-2">
            {open ? <Badge tone="accent">Open</Badge> : <Badge>Closed</Badge>}
            {round.outcome === 'approved' && <Badge tone="success">Review approved</Badge>}
            {round.outcome === 'draft' && <Badge tone="warning">Back to draft</Badge>}
          </p>
        </div>
        <p className="text-ink-muted text-sm">
          Opened by {round.openedByName} · due <LocalTime iso={round.dueAt} />
          {round.closedAt && (
            <>
              {' '}
              · closed <LocalTime iso={round.closedAt} />
            </>
          )}{' '}
          · {submitted} of {round.invitations.length} submitted
        </p>
        <ul className="flex flex-wrap gap-2 text-sm">
          {round.invitations.map((i) => (
            <li key={i.reviewerId}>
              <Badge tone={i.submittedAt ? 'success' : i.closedWithoutReason ? 'neutral' : 'warning'}>
                {i.reviewerName}: {i.submittedAt ? 'submitted' : i.closedWithoutReason ? 'closed without' : 'waiting'}
              </Badge>
              {i.closedWithoutReason && <span className="text-ink-muted ml-1 text-xs">({i.closedWithoutReason})</span>}
            </li>
          ))}
        </ul>
      </div>

      {agreement.error && (
        <p role="alert" className="text-danger-700 text-sm">
          The agreement could not be loaded: {agreement.error.message}
        </p>
      )}
      {agreement.data && (
        <AgreementPanel
          agreement={agreement.data}
          renderResolution={(row) =>
            open && row.flagged ? (
              <ResolutionForm reviewId={reviewId} roundId={round.id} row={row} onSaved={refresh} />
            ) : null
          }
        />
      )}

      <CommentThreads
        reviewId={reviewId}
        roundId={round.id}
        mechanisms={mechanisms}
        open={open}
        canResolve={round.you.manages}
      />

      {open && round.you.manages && (
        <CloseRoundForm
          reviewId={reviewId}
          round={round}
          agreement={agreement.data}
          onClosed={(outcome, failures) => {
            onNotice(
              `Round closed: the review is now ${outcome === 'approved' ? 'approved' : 'back in draft'}.${
                failures.length ? ` The closing mail to ${failures.join(', ')} could not be sent.` : ''
              }`,
            );
            void mutate(commentsKey(reviewId, round.id));
            void mutate(agreementKey(reviewId, round.id));
            onChanged();
          }}
        />
      )}
      {!open && round.you.manages && round.outcome === 'approved' && (
        <LinkButton href={`/reviews/${reviewId}`}>Open the workbench</LinkButton>
      )}
    </section>
  );
}

'use client';

import { useId, useState } from 'react';
import { LocalTime } from '@/components/review/LocalTime';
import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import type { CommentDTO } from '@/lib/rounds/types';
import { apiFetch, errorMessage } from '@/lib/swr/fetcher';
import { useComments } from '@/lib/swr/use-rounds';

/**
 * The round's discussion: threads anchored to a mechanism or to the whole review, one level of
 * replies, resolvable by the author or owner. A failed post keeps the text in the box.
 */
export function CommentThreads({
  reviewId,
  roundId,
  mechanisms,
  open,
  canResolve,
}: {
  reviewId: number;
  roundId: number;
  mechanisms: { id: number; name: string }[];
  open: boolean;
  canResolve: boolean;
}) {
  const { data, error, mutate, isLoading } = useComments(reviewId, roundId);
  const comments = data?.comments ?? [];
  const roots = comments.filter((c) => c.parentId === null);
  const repliesOf = (id: number) => comments.filter((c) => c.parentId === id);
  const anchorName = (mechanismId: number | null) =>
    mechanismId === null
      ? 'The whole review'
      : (mechanisms.find((m) => m.id === mechanismId)?.name ?? 'A removed mechanism');

  const post = async (json: { body: string; mechanismId?: number | null; parentId?: number }) => {
    await apiFetch(`/api/reviews/${reviewId}/comments`, { method: 'POST', json: { ...json, roundId } });
    await mutate();
  };
  const resolve = async (comment: CommentDTO, resolved: boolean) => {
    await apiFetch(`/api/reviews/${reviewId}/comments/${comment.id}`, { method: 'PATCH', json: { resolved } });
    await mutate();
  };

  return (
    <section aria-labelledby={`comments-${roundId}`} className="space-y-4">
      <h2 id={`comments-${roundId}`} className="text-xl font-semibold">
        Discussion
      </h2>
      {error && (
        <p role="alert" className="text-danger-700 text-sm">
          The comments could not be loaded: {error.message}
        </p>
      )}
      {isLoading && <p className="text-ink-muted text-sm">Loading comments…</p>}
      {!isLoading && !error && roots.length === 0 && (
        <p className="text-ink-muted text-sm">No comments yet. Start a thread on a mechanism or on the whole review.</p>
      )}
      <ul className="space-y-3">
        {roots.map((root) => (
          <li key={root.id} id={`comment-${root.id}`} className="border-line bg-paper-raised rounded-lg border p-4">
            <p className="mb-2 flex flex-wrap items-center gap-2 text-xs">
              <Badge tone="brand">{anchorName(root.mechanismId)}</Badge>
              {root.resolved && (
                <Badge tone="success">Resolved{root.resolvedByName ? ` by ${root.resolvedByName}` : ''}</Badge>
              )}
            </p>
            <CommentBody comment={root} />
            <ul className="border-line mt-3 space-y-3 border-l-2 pl-4">
              {repliesOf(root.id).map((reply) => (
                <li key={reply.id} id={`comment-${reply.id}`}>
                  <CommentBody comment={reply} />
                </li>
              ))}
            </ul>
            <div className="mt-3 flex flex-wrap items-start gap-2">
              {open && <ReplyBox onSend={(body) => post({ body, parentId: root.id })} />}
              {open && canResolve && (
                <ResolveButton resolved={root.resolved} onToggle={() => resolve(root, !root.resolved)} />
              )}
            </div>
          </li>
        ))}
      </ul>
      {open && <NewThread mechanisms={mechanisms} onSend={(body, mechanismId) => post({ body, mechanismId })} />}
    </section>
  );
}

function CommentBody({ comment }: { comment: CommentDTO }) {
  return (
    <div>
      <p className="text-sm">
        <span className="font-semibold">{comment.authorName}</span>{' '}
        <span className="text-ink-muted">
          <LocalTime iso={comment.createdAt} />
        </span>
      </p>
      <p className="mt-1 whitespace-pre-line">{comment.body}</p>
    </div>
  );
}

function ResolveButton({ resolved, onToggle }: { resolved: boolean; onToggle: () => Promise<void> }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <span>
      <Button
        variant="ghost"
        size="sm"
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          setError(null);
          try {
            await onToggle();
          } catch (e) {
            setError(errorMessage(e));
          } finally {
            setBusy(false);
          }
        }}
      >
        {resolved ? 'Reopen thread' : 'Mark resolved'}
      </Button>
      {error && (
        <span role="alert" className="text-danger-700 block text-sm">
          {error}
        </span>
      )}
    </span>
  );
}

function useSender(onSend: (body: string) => Promise<void>) {
  const [text, setText] = useState('');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const send = async () => {
    if (!text.trim()) {
      setError('Write something first.');
      return;
    }
    setBusy(true);
    setError(null);
    try {
      await onSend(text.trim());
      setText('');
    } catch (e) {
      // The text stays in the box, so nothing typed is lost.
      setError(errorMessage(e));
    } finally {
      setBusy(false);
    }
  };
  return { text, setText, busy, error, send };
}

function ReplyBox({ onSend }: { onSend: (body: string) => Promise<void> }) {
  const [opened, setOpened] = useState(false);
  const s = useSender(onSend);
  const id = useId();
  if (!opened)
    return (
      <Button variant="secondary" size="sm" onClick={() => setOpened(true)}>
        Reply
      </Button>
    );
  return (
    <div className="w-full space-y-2">
      <label htmlFor={id} className="text-sm font-semibold">
        Your reply
      </label>
      <textarea
        id={id}
        value={s.text}
        onChange={(e) => s.setText(e.target.value)}
        rows={3}
        className="border-line-strong bg-paper-raised block w-full rounded-md border px-3 py-2"
        aria-describedby={s.error ? `${id}-error` : undefined}
      />
      {s.error && (
        <p id={`${id}-error`} role="alert" className="text-danger-700 text-sm">
          {s.error}
        </p>
      )}
      <div className="flex gap-2">
        <Button size="sm" disabled={s.busy} onClick={s.send}>
          {s.busy ? 'Sending…' : 'Send reply'}
        </Button>
        <Button size="sm" variant="ghost" onClick={() => setOpened(false)}>
          Cancel
        </Button>
      </div>
    </div>
  );
}

function NewThread({
  mechanisms,
  onSend,
}: {
  mechanisms: { id: number; name: string }[];
  onSend: (body: string, mechanismId: number | null) => Promise<void>;
}) {
  const [anchor, setAnchor] = useState('');
  const s = useSender((body) => onSend(body, anchor ? Number(anchor) : null));
  const id = useId();
  return (
    <div className="border-line bg-paper-sunken/60 space-y-2 rounded-lg border p-4">
      <h3 className="text-base font-semibold">Start a thread</h3>
      <div className="grid gap-2 sm:grid-cols-[16rem_1fr]">
        <div>
          <label htmlFor={`${id}-anchor`} className="block text-sm font-semibold">
            About
          </label>
          <select
            id={`${id}-anchor`}
            value={anchor}
            onChange={(e) => setAnchor(e.target.value)}
            className="border-line-strong bg-paper-raised mt-1 block w-full rounded-md border px-3 py-2"
          >
            <option value="">The whole review</option>
            {mechanisms.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor={`${id}-body`} className="block text-sm font-semibold">
            Comment
          </label>
          <textarea
            id={`${id}-body`}
            value={s.text}
            onChange={(e) => s.setText(e.target.value)}
            rows={3}
            className="border-line-strong bg-paper-raised mt-1 block w-full rounded-md border px-3 py-2"
          />
        </div>
      </div>
      {s.error && (
        <p role="alert" className="text-danger-700 text-sm">
          {s.error}
        </p>
      )}
      <Button size="sm" disabled={s.busy} onClick={s.send}>
        {s.busy ? 'Posting…' : 'Post comment'}
      </Button>
    </div>
  );
}

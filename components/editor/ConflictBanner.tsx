'use client';

import { Button } from '@/components/ui/Button';
import type { ReviewDTO } from '@/lib/reviews/types';
import { dateTime } from '@/components/review/labels';
import { PROSE } from './prose';

/**
 * Shown when a save came back 409: the review changed on the server since this editor loaded it.
 * Autosave is paused until the coach chooses; typing can go on meanwhile and is kept either way.
 */
export function ConflictBanner({
  theirs,
  busy,
  onReloadTheirs,
  onKeepMine,
}: {
  theirs: ReviewDTO | null;
  busy: boolean;
  onReloadTheirs: () => void;
  onKeepMine: () => void;
}) {
  return (
    <div
      role="alert"
      data-testid="conflict-banner"
      className="border-warning-100 bg-warning-50 text-warning-800 space-y-3 border-b px-4 py-3.5 text-sm"
    >
      <div className="space-y-1">
        <p className="font-semibold">Someone else changed this review while you were writing.</p>
        <p>
          {theirs ? `Their version was saved ${dateTime(theirs.updatedAt)}. ` : 'Their version is on the server. '}
          Your changes are not saved yet and nothing you typed is lost. Choose what to do:
        </p>
        <ul className="list-disc space-y-0.5 pl-5">
          <li>
            <strong>Reload theirs</strong> replaces your text with theirs (Ctrl+Z still brings yours back).
          </li>
          <li>
            <strong>Keep mine as a copy</strong> copies your text to the clipboard and shows it beside the editor, then
            loads theirs, so you can paste back what you need.
          </li>
        </ul>
      </div>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" size="sm" onClick={onReloadTheirs} disabled={busy}>
          Reload theirs
        </Button>
        <Button variant="primary" size="sm" onClick={onKeepMine} disabled={busy}>
          Keep mine as a copy
        </Button>
      </div>
    </div>
  );
}

/** The coach's own text after "Keep mine as a copy": visible until they dismiss it. */
export function KeptCopy({
  html,
  copied,
  onCopyAgain,
  onDismiss,
}: {
  html: string;
  copied: boolean | null;
  onCopyAgain: () => void;
  onDismiss: () => void;
}) {
  return (
    <section
      aria-labelledby="kept-copy-title"
      data-testid="kept-copy"
      className="border-granite-200 bg-granite-50 space-y-3 border-b px-4 py-3.5 text-sm"
    >
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="space-y-1">
          <h3 id="kept-copy-title" className="text-base font-semibold">
            Your text, kept as a copy
          </h3>
          <p className="text-ink-muted">
            {copied === true
              ? 'It is on your clipboard too: paste it into the editor (mechanism blocks and citations come back) or anywhere else.'
              : copied === false
                ? 'The browser did not let us use the clipboard; select the text below and copy it by hand.'
                : 'Copying to the clipboard…'}{' '}
            The editor now shows their version.
          </p>
        </div>
        <div className="flex gap-2">
          <Button variant="secondary" size="sm" onClick={onCopyAgain}>
            Copy again
          </Button>
          <Button variant="ghost" size="sm" onClick={onDismiss}>
            Dismiss
          </Button>
        </div>
      </div>
      <div
        className={`${PROSE} border-line bg-paper-raised max-h-72 overflow-y-auto rounded-md border px-4 py-2`}
        // Our own editor produced this HTML from our own schema (text is escaped by ProseMirror).
        dangerouslySetInnerHTML={{ __html: html }}
      />
    </section>
  );
}

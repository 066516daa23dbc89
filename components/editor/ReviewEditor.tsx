'use client';

import type { Node as ProseMirrorNode } from '@tiptap/pm/model';
import { EditorContent, ReactNodeViewRenderer, useEditor, type Editor } from '@tiptap/react';
import { useEffect, useMemo, useRef, useState } from 'react';
import dynamic from 'next/dynamic';
import { useSWRConfig } from 'swr';
import { Button } from '@/components/ui/Button';
import { cn } from '@/components/ui/cn';
import { dateTime } from '@/components/review/labels';
import { useWorkbenchContext, type WorkbenchContextValue } from '@/components/review/workbench-context';
import type { ReviewDTO, StudyDTO } from '@/lib/reviews/types';
import { apiFetch, errorMessage } from '@/lib/swr/fetcher';
import { isReviewKey } from '@/lib/swr/keys';
import { toEditorContent } from './body';
import { BodyPreviewFrame } from './BodyPreview';
import { CitationView } from './CitationView';
import { EditorToolbar } from './EditorToolbar';
import { Citation } from './extensions/citation';
import { basicExtensions } from './extensions/kit';
import { MechanismBlock } from './extensions/mechanism-block';
import { MechanismBlockView } from './MechanismBlockView';
import { PROSE } from './prose';
import type { ReviewSaver } from './review-saver';
import { useAutosave, type SaveStatus } from './use-autosave';

// The citation dialog brings the study search (fuse.js); it is fetched the first time it opens.
// Shown only after a conflicting save.
const ConflictBanner = dynamic(() => import('./ConflictBanner').then((m) => m.ConflictBanner), { ssr: false });
const KeptCopy = dynamic(() => import('./ConflictBanner').then((m) => m.KeptCopy), { ssr: false });
const CitationPicker = dynamic(() => import('./CitationPicker').then((m) => m.CitationPicker), { ssr: false });

function statusText(status: SaveStatus): string {
  switch (status.kind) {
    case 'saved':
      return status.at ? `Saved · ${dateTime(status.at)}` : 'Saved';
    case 'pending':
      return 'Unsaved changes';
    case 'saving':
      return 'Saving…';
    case 'retrying':
      return 'Couldn’t save — retrying';
    case 'failed':
      return 'Couldn’t save';
    case 'conflict':
      return 'Not saved — someone else changed this review';
  }
}

/** Puts the coach's text on the clipboard as HTML (our nodes survive a paste) and plain text. */
async function copyToClipboard(html: string, text: string): Promise<boolean> {
  try {
    if (typeof ClipboardItem !== 'undefined' && navigator.clipboard?.write) {
      await navigator.clipboard.write([
        new ClipboardItem({
          'text/html': new Blob([html], { type: 'text/html' }),
          'text/plain': new Blob([text], { type: 'text/plain' }),
        }),
      ]);
      return true;
    }
    await navigator.clipboard.writeText(text);
    return true;
  } catch {
    return false;
  }
}

/** A holder for the latest workbench that lives outside React's render (an external store). */
interface LiveWorkbench {
  get(): WorkbenchContextValue | null;
  set(value: WorkbenchContextValue): void;
}
function liveWorkbench(): LiveWorkbench {
  let current: WorkbenchContextValue | null = null;
  return {
    get: () => current,
    set: (value) => {
      current = value;
    },
  };
}

/**
 * The editor's extensions, built once per editor. They read the latest workbench through the
 * ref (only when a block is opened or the text is copied, never while rendering), so a renamed
 * mechanism or a corrected reference shows without re-creating the editor.
 */
function buildExtensions(live: LiveWorkbench) {
  return [
    ...basicExtensions(),
    MechanismBlock.extend({ addNodeView: () => ReactNodeViewRenderer(MechanismBlockView) }).configure({
      onOpen: (id) => live.get()?.openMechanism(id),
      describe: (id) => live.get()?.mechanisms.get(id)?.name,
    }),
    Citation.extend({ addNodeView: () => ReactNodeViewRenderer(CitationView, { as: 'span' }) }).configure({
      describe: (id) => live.get()?.studies.get(id)?.citation,
    }),
  ];
}

/**
 * The review body: a Tiptap editor with our mechanism blocks and citations, a toolbar, autosave
 * with the review's version, and the conflict flow of a stale save.
 */
export function ReviewEditor({
  review,
  saver,
  editable,
  library,
  libraryLoading,
  libraryError,
  onAddMechanism,
  onPickCitation,
  onEditor,
}: {
  review: ReviewDTO;
  saver: ReviewSaver;
  editable: boolean;
  library: readonly StudyDTO[];
  libraryLoading: boolean;
  libraryError?: string;
  onAddMechanism: () => void;
  /** The citation picker is opening: the library it searches is wanted now. */
  onPickCitation?: () => void;
  onEditor?: (editor: Editor | null) => void;
}) {
  const workbench = useWorkbenchContext();
  const { mutate } = useSWRConfig();
  const live = useMemo(() => liveWorkbench(), []);
  useEffect(() => {
    live.set(workbench);
  }, [live, workbench]);

  const [pickerOpen, setPickerOpen] = useState(false);
  // Mounted from its first opening on, so later openings are instant and closing keeps its state.
  const [pickerUsed, setPickerUsed] = useState(false);
  if (pickerOpen && !pickerUsed) setPickerUsed(true);
  const [contentError, setContentError] = useState<string | null>(null);
  const [resolving, setResolving] = useState(false);
  const [kept, setKept] = useState<{ html: string; text: string; copied: boolean | null } | null>(null);

  const extensions = useMemo(() => buildExtensions(live), [live]);

  const autosaveRef = useRef<(() => void) | null>(null);
  // The document as last loaded or saved: an update that leaves it equal (a selection-only
  // change, a no-op normalisation) is not an edit and must not create a new version.
  const baseline = useRef<ProseMirrorNode | null>(null);
  const editor = useEditor({
    immediatelyRender: false,
    extensions,
    content: toEditorContent(review.body),
    editable,
    enableContentCheck: true,
    onContentError: ({ error }) => {
      // Never autosave over a body we could not read in full: that would delete the unread part.
      setContentError(error.message);
    },
    onCreate: ({ editor: created }) => {
      baseline.current = created.state.doc;
    },
    onUpdate: ({ editor: updated }) => {
      if (!baseline.current) baseline.current = updated.state.doc;
      if (updated.state.doc.eq(baseline.current)) return;
      autosaveRef.current?.();
    },
    editorProps: {
      attributes: {
        id: 'review-body',
        role: 'textbox',
        'aria-multiline': 'true',
        'aria-label': 'Review text',
        class: 'min-h-72 px-5 py-4 focus:outline-none focus-visible:outline-none',
      },
    },
  });

  const canSave = editable && !contentError;
  const { status, conflict, markChanged, flush, resolved } = useAutosave(editor, saver, canSave);
  useEffect(() => {
    autosaveRef.current = markChanged;
  }, [markChanged]);

  useEffect(() => {
    // No update event: toggling editability is not an edit.
    editor?.setEditable(canSave, false);
  }, [editor, canSave]);

  useEffect(() => {
    onEditor?.(editor);
    return () => onEditor?.(null);
  }, [editor, onEditor]);

  const loadTheirs = async (): Promise<ReviewDTO | null> => {
    if (!editor) return null;
    const theirs: ReviewDTO =
      conflict?.theirs ?? (await apiFetch<{ review: ReviewDTO }>(`/api/reviews/${review.id}`)).review;
    // One history step: Ctrl+Z right after brings the coach's text back.
    editor.commands.setContent(toEditorContent(theirs.body), { emitUpdate: false });
    baseline.current = editor.state.doc;
    resolved(theirs);
    void mutate(isReviewKey(review.id));
    return theirs;
  };

  const onReloadTheirs = async () => {
    setResolving(true);
    try {
      await loadTheirs();
    } catch (error) {
      setContentError(`Could not load their version: ${errorMessage(error)}`);
    } finally {
      setResolving(false);
    }
  };

  const onKeepMine = async () => {
    if (!editor) return;
    setResolving(true);
    // Read the coach's text first, including what they typed after the conflict appeared.
    const html = editor.getHTML();
    const text = editor.getText({ blockSeparator: '\n\n' });
    setKept({ html, text, copied: null });
    const copied = await copyToClipboard(html, text);
    setKept({ html, text, copied });
    try {
      await loadTheirs();
    } catch (error) {
      setContentError(`Could not load their version: ${errorMessage(error)}`);
    } finally {
      setResolving(false);
    }
  };

  const insertCitation = (study: StudyDTO) => {
    setPickerOpen(false);
    // After the dialog has handed focus back, put it in the text and insert there.
    requestAnimationFrame(() => editor?.chain().focus().insertCitation(study.id).run());
  };

  const saveState = status.kind;
  return (
    <section aria-labelledby="review-body-title" className="border-line bg-paper-raised shadow-card rounded-lg border">
      <div className="border-line flex flex-wrap items-center justify-between gap-2 border-b px-5 py-3">
        <h2 id="review-body-title" className="text-lg font-semibold">
          Analysis
        </h2>
        {editable && (
          <p
            role="status"
            aria-live="polite"
            data-testid="save-status"
            data-state={saveState}
            className={cn(
              'flex items-center gap-2 text-sm',
              saveState === 'saved' && 'text-ink-muted',
              (saveState === 'pending' || saveState === 'saving') && 'text-ink-muted',
              (saveState === 'retrying' || saveState === 'conflict') && 'text-warning-800 font-semibold',
              saveState === 'failed' && 'text-danger-700 font-semibold',
            )}
          >
            <span
              aria-hidden="true"
              className={cn(
                'inline-block size-2 rounded-full',
                saveState === 'saved' && 'bg-success-500',
                (saveState === 'pending' || saveState === 'saving') && 'bg-chalk-400',
                saveState === 'saving' && 'animate-pulse',
                (saveState === 'retrying' || saveState === 'conflict') && 'bg-warning-500',
                saveState === 'failed' && 'bg-danger-500',
              )}
            />
            {statusText(status)}
          </p>
        )}
      </div>

      {(status.kind === 'retrying' || status.kind === 'failed') && (
        <div className="border-line bg-paper-sunken flex flex-wrap items-center justify-between gap-2 border-b px-5 py-2 text-sm">
          <span>
            {status.message} Your text stays here{status.kind === 'retrying' ? ' while we retry' : ''}.
          </span>
          <Button size="sm" variant="secondary" onClick={() => void flush()}>
            Try again now
          </Button>
        </div>
      )}
      {contentError && (
        <p role="alert" className="border-danger-100 bg-danger-50 text-danger-800 border-b px-5 py-3 text-sm">
          Part of the stored text could not be shown, so editing is paused to keep it intact. ({contentError})
        </p>
      )}
      {conflict && (
        <ConflictBanner
          theirs={conflict.theirs}
          busy={resolving}
          onReloadTheirs={() => void onReloadTheirs()}
          onKeepMine={() => void onKeepMine()}
        />
      )}
      {kept && (
        <KeptCopy
          html={kept.html}
          copied={kept.copied}
          onCopyAgain={() => void copyToClipboard(kept.html, kept.text).then((copied) => setKept({ ...kept, copied }))}
          onDismiss={() => setKept(null)}
        />
      )}

      {/* The toolbar is there from the first paint, disabled until the editor exists, so the
          text below it does not move down when the editor arrives. */}
      {editable && (
        <EditorToolbar
          // A new toolbar when the editor arrives: its state hook caches the editor it started
          // with until the first transaction, which would leave the tools disabled until then.
          key={editor ? 'editor' : 'waiting'}
          editor={editor}
          onAddMechanism={onAddMechanism}
          onInsertCitation={() => {
            onPickCitation?.();
            setPickerOpen(true);
          }}
        />
      )}
      {editable && (
        <p className="border-line text-ink-muted border-b px-5 py-2 text-sm">
          Write the analysis; add each candidate mechanism as a block and cite library studies inline. Saved
          automatically.
        </p>
      )}
      {editor ? (
        <EditorContent editor={editor} className={PROSE} />
      ) : (
        // Until the editor exists (it is created after hydration), the same text drawn as the
        // editor draws it, rendered on the server at its final size, so nothing below it moves
        // when the editor takes its place (docs/architecture.md, "The workbench's weight").
        <BodyPreviewFrame body={toEditorContent(review.body)} busy />
      )}

      {pickerUsed && (
        <CitationPicker
          open={pickerOpen}
          studies={library}
          loading={libraryLoading}
          error={libraryError}
          onPick={insertCitation}
          onClose={() => setPickerOpen(false)}
        />
      )}
    </section>
  );
}

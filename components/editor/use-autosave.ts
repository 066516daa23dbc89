'use client';

import type { Editor, JSONContent } from '@tiptap/core';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { ReviewDTO } from '@/lib/reviews/types';
import { ApiError, apiFetch } from '@/lib/swr/fetcher';
import type { ReviewSaver } from './review-saver';

/** Quiet time after the last keystroke before the body is saved. */
export const AUTOSAVE_DELAY_MS = 1500;
const RETRY_FIRST_MS = 2000;
const RETRY_MAX_MS = 30_000;

export type SaveStatus =
  | { kind: 'saved'; at: string | null }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'retrying'; message: string }
  | { kind: 'failed'; message: string }
  | { kind: 'conflict' };

export interface Conflict {
  /** Their version, from the 409 body or fetched after it. */
  theirs: ReviewDTO | null;
}

/**
 * Debounced autosave of the review body with the review's version.
 *
 * - A change schedules a save 1.5 s after the last keystroke; a change during a save schedules
 *   another one after it, so the last keystroke is always saved.
 * - Network failures, 5xx, 429 and 401 retry with a growing delay (2 s … 30 s); the text stays
 *   in the editor and the page warns before it is closed with unsaved changes.
 * - 400/403/404/413 do not retry (the same body would fail the same way): the status says why.
 * - 409 pauses autosave and hands the conflict to the banner; nothing is overwritten.
 */
export function useAutosave(editor: Editor | null, saver: ReviewSaver, enabled: boolean) {
  const [status, setStatus] = useState<SaveStatus>({ kind: 'saved', at: null });
  const [conflict, setConflict] = useState<Conflict | null>(null);
  const dirty = useRef(false);
  const saving = useRef(false);
  const paused = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const attempt = useRef(0);
  const editorRef = useRef(editor);
  useEffect(() => {
    editorRef.current = editor;
  }, [editor]);
  // The save below schedules itself again (debounce, retries); timers call it through this ref.
  const saveRef = useRef<(options?: { keepalive?: boolean }) => Promise<void>>(async () => {});

  const clearTimer = () => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
  };

  const save = useCallback(
    async ({ keepalive = false }: { keepalive?: boolean } = {}) => {
      const current = editorRef.current;
      if (!current || paused.current || !dirty.current) return;
      if (saving.current) return; // the running save reschedules itself when it sees `dirty`
      let body: JSONContent;
      try {
        body = current.getJSON();
      } catch {
        return; // the editor is gone (page left after a conflict); nothing left to read
      }
      clearTimer();
      saving.current = true;
      dirty.current = false;
      setStatus({ kind: 'saving' });
      try {
        const review = await saver.patch({ body }, { keepalive });
        attempt.current = 0;
        saving.current = false;
        if (dirty.current) {
          setStatus({ kind: 'pending' });
          timer.current = setTimeout(() => void saveRef.current(), AUTOSAVE_DELAY_MS);
        } else {
          setStatus({ kind: 'saved', at: review.updatedAt });
        }
      } catch (error) {
        saving.current = false;
        dirty.current = true;
        const status = error instanceof ApiError ? error.status : 0;
        if (status === 409) {
          paused.current = true;
          setStatus({ kind: 'conflict' });
          let theirs = error instanceof ApiError ? ((error.body.current as ReviewDTO | undefined) ?? null) : null;
          if (!theirs) {
            theirs = await apiFetch<{ review: ReviewDTO }>(`/api/reviews/${saver.reviewId}`)
              .then((w) => w.review)
              .catch(() => null);
          }
          setConflict({ theirs });
          return;
        }
        const message = error instanceof ApiError ? error.message : 'Could not reach the server.';
        if ([400, 403, 404, 413].includes(status)) {
          setStatus({ kind: 'failed', message });
          return;
        }
        const delay = Math.min(RETRY_MAX_MS, RETRY_FIRST_MS * 2 ** attempt.current);
        attempt.current += 1;
        setStatus({
          kind: 'retrying',
          message: status === 401 ? 'You were signed out. Sign in again in another tab; we keep trying.' : message,
        });
        timer.current = setTimeout(() => void saveRef.current(), delay);
      }
    },
    [saver],
  );
  useEffect(() => {
    saveRef.current = save;
  }, [save]);

  /** Call on every change of the document. */
  const markChanged = useCallback(() => {
    if (!enabled) return;
    dirty.current = true;
    if (paused.current) return;
    clearTimer();
    if (!saving.current) setStatus({ kind: 'pending' });
    timer.current = setTimeout(() => void save(), AUTOSAVE_DELAY_MS);
  }, [enabled, save]);

  /** Save now (the "Try again" button, leaving the page). */
  const flush = useCallback(() => {
    attempt.current = 0;
    return save();
  }, [save]);

  /** After the coach resolved a conflict by loading their version at `version`. */
  const resolved = useCallback(
    (review: ReviewDTO) => {
      saver.adopt(review.version);
      paused.current = false;
      dirty.current = false;
      attempt.current = 0;
      clearTimer();
      setConflict(null);
      setStatus({ kind: 'saved', at: review.updatedAt });
    },
    [saver],
  );

  // Leaving: save what is pending (keepalive lets the request outlive the page) and warn when
  // something could still be lost.
  useEffect(() => {
    const onHide = () => {
      if (document.visibilityState === 'hidden' && dirty.current) void save({ keepalive: true });
    };
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      if (dirty.current || saving.current) event.preventDefault();
    };
    document.addEventListener('visibilitychange', onHide);
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => {
      document.removeEventListener('visibilitychange', onHide);
      window.removeEventListener('beforeunload', onBeforeUnload);
      // Navigating away inside the app unmounts us: save what the debounce still holds.
      if (dirty.current && !paused.current) void save({ keepalive: true });
      clearTimer();
    };
  }, [save]);

  return { status, conflict, markChanged, flush, resolved };
}

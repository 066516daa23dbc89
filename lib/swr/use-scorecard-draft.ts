'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import type { RatingDTO, ScorecardViewDTO, SignOff } from '@/lib/rounds/types';
import { apiFetch, ApiError, errorMessage } from './fetcher';
import { INCOMPLETE_SCORECARD, scorecardGaps } from '@/lib/rounds/scorecard-complete';

export type SaveState = { kind: 'idle' | 'saving' | 'saved' | 'error'; at?: string; message?: string };

/**
 * A reviewer's scorecard as a draft: PUT /api/reviews/:id/rounds/:roundId/scorecard a moment
 * after each change, a warning before leaving with changes the server has not confirmed, and
 * the final submit, whose refusals come back as field errors.
 */
export function useScorecardDraft(view: ScorecardViewDTO) {
  const { round, review } = view;
  const [ratings, setRatings] = useState<RatingDTO[]>(view.scorecard.ratings);
  const [overall, setOverallState] = useState(view.scorecard.overallComment);
  const [signOff, setSignOffState] = useState<SignOff | null>(view.scorecard.signOff);
  const [submittedAt, setSubmittedAt] = useState<string | null>(view.scorecard.submittedAt);
  const [save, setSave] = useState<SaveState>({
    kind: view.scorecard.updatedAt ? 'saved' : 'idle',
    at: view.scorecard.updatedAt ?? undefined,
  });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [submitError, setSubmitError] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [submitting, setSubmitting] = useState(false);
  const dirty = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  const locked = Boolean(submittedAt) || round.status !== 'open';

  const payload = useCallback(
    (submit: boolean) => ({ ratings, overallComment: overall, signOff, submit }),
    [ratings, overall, signOff],
  );

  const saveDraft = useCallback(async () => {
    if (locked) return;
    setSave({ kind: 'saving' });
    try {
      const res = await apiFetch<{ scorecard: { updatedAt: string } }>(
        `/api/reviews/${review.id}/rounds/${round.id}/scorecard`,
        { method: 'PUT', json: payload(false) },
      );
      dirty.current = false;
      setSave({ kind: 'saved', at: res.scorecard.updatedAt });
    } catch (error) {
      // The draft stays on screen; the next change (or the retry button) saves it again.
      setSave({ kind: 'error', message: errorMessage(error) });
    }
  }, [locked, payload, review.id, round.id]);

  // Autosave: a moment after the last change.
  useEffect(() => {
    if (!dirty.current || locked) return;
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => void saveDraft(), 700);
    return () => {
      if (timer.current) clearTimeout(timer.current);
    };
  }, [ratings, overall, signOff, saveDraft, locked]);

  // Warn before leaving with changes the server has not confirmed.
  useEffect(() => {
    const warn = (event: BeforeUnloadEvent) => {
      if (dirty.current) event.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, []);

  const change = (mechanismId: number, patch: Partial<RatingDTO>) => {
    dirty.current = true;
    setRatings((list) => list.map((r) => (r.mechanismId === mechanismId ? { ...r, ...patch } : r)));
    setErrors((e) => {
      const next = { ...e };
      for (const key of Object.keys(patch)) delete next[`mechanism.${mechanismId}.${key}`];
      return next;
    });
  };

  const setOverall = (value: string) => {
    dirty.current = true;
    setOverallState(value);
  };

  const setSignOff = (value: SignOff) => {
    dirty.current = true;
    setSignOffState(value);
    setErrors(({ signOff: _gone, ...rest }) => rest);
  };

  // Check first: "you cannot change this afterwards" is asked only of a complete scorecard.
  const askToSubmit = () => {
    const gaps = scorecardGaps(view.mechanisms, { ratings, signOff });
    if (gaps.length) {
      setErrors(Object.fromEntries(gaps.map((g) => [g.path, g.message])));
      setSubmitError(INCOMPLETE_SCORECARD);
      return;
    }
    setSubmitError(null);
    setConfirming(true);
  };

  const submit = async () => {
    setSubmitting(true);
    setSubmitError(null);
    if (timer.current) clearTimeout(timer.current);
    try {
      const res = await apiFetch<{ scorecard: { submittedAt: string }; mailFailures: string[] }>(
        `/api/reviews/${review.id}/rounds/${round.id}/scorecard`,
        { method: 'PUT', json: payload(true) },
      );
      dirty.current = false;
      setSubmittedAt(res.scorecard.submittedAt);
      setConfirming(false);
      window.scrollTo({ top: 0 });
    } catch (error) {
      if (error instanceof ApiError && error.issues.length) {
        const map: Record<string, string> = {};
        for (const issue of error.issues) map[issue.path] = issue.message;
        setErrors(map);
      }
      setSubmitError(errorMessage(error));
      setConfirming(false);
    } finally {
      setSubmitting(false);
    }
  };

  return {
    ratings,
    overall,
    signOff,
    submittedAt,
    save,
    errors,
    submitError,
    confirming,
    submitting,
    locked,
    change,
    setOverall,
    setSignOff,
    setConfirming,
    askToSubmit,
    saveDraft,
    submit,
  };
}

'use client';

import { useState } from 'react';
import { useSWRConfig } from 'swr';
import { DESIGN_LABEL } from '@/components/review/labels';
import type { StudyDesign } from '@/lib/reviews/types';
import { apiFetch, errorMessage } from '@/lib/swr/fetcher';
import { isStudiesKey } from '@/lib/swr/keys';

/**
 * The design a study's title or keywords name, offered until the coach confirms it: one click
 * sets it (PATCH /api/studies/:id), so an imported study can be appraised without opening
 * "Edit details". The suggestion never counts on its own; only a confirmed design starts the
 * certainty working (docs/scoring.md §1).
 */
export function SuggestedDesign({
  studyId,
  design,
  onConfirmed,
}: {
  studyId: number;
  design: StudyDesign;
  onConfirmed?: (studyId: number) => void;
}) {
  const { mutate } = useSWRConfig();
  const [state, setState] = useState<'idle' | 'saving' | 'done'>('idle');
  const [error, setError] = useState<string | null>(null);

  const confirm = async () => {
    setState('saving');
    setError(null);
    try {
      await apiFetch(`/api/studies/${studyId}`, { method: 'PATCH', json: { design } });
      setState('done');
      onConfirmed?.(studyId);
      void mutate(isStudiesKey);
    } catch (e) {
      setState('idle');
      setError(errorMessage(e));
    }
  };

  if (state === 'done')
    return (
      <span className="text-success-700 text-sm" role="status">
        Design set: {DESIGN_LABEL[design]} ✓
      </span>
    );
  return (
    <span className="inline-flex flex-wrap items-center gap-x-2 gap-y-1 text-sm" data-testid="suggested-design">
      <span>
        <span className="text-ink-muted">Suggested design:</span> {DESIGN_LABEL[design]}
      </span>
      <button
        type="button"
        onClick={confirm}
        disabled={state === 'saving'}
        aria-label={`Confirm design ${DESIGN_LABEL[design]}`}
        className="border-line-strong hover:border-brand text-brand min-h-8 rounded-md border px-2 text-sm font-semibold disabled:opacity-60"
      >
        {state === 'saving' ? 'Saving…' : 'Confirm'}
      </button>
      {error && (
        <span role="alert" className="text-danger-700 basis-full text-sm">
          {error}
        </span>
      )}
    </span>
  );
}

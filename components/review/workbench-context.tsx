'use client';

import { createContext, useContext } from 'react';
import type { MechanismDTO, ReviewDTO, StudyDTO, VerdictMechanismDTO } from '@/lib/reviews/types';

/**
 * What the pieces of the workbench share. The editor's node views are rendered by Tiptap
 * through React portals inside <EditorContent>, so they read this context like any other
 * child — that is how a mechanism block shows a probability that changes when an appraisal is
 * saved elsewhere on the page, without re-creating the editor.
 */
export interface WorkbenchContextValue {
  reviewId: number;
  review: ReviewDTO;
  mechanisms: ReadonlyMap<number, MechanismDTO>;
  /** Every library study we know of (the review's own and the team library), by id. */
  studies: ReadonlyMap<number, StudyDTO>;
  /** The verdict's row per mechanism id; empty while the verdict loads. */
  scores: ReadonlyMap<number, VerdictMechanismDTO>;
  verdictLoading: boolean;
  canEdit: boolean;
  openMechanism: (mechanismId: number) => void;
}

export const WorkbenchContext = createContext<WorkbenchContextValue | null>(null);

export function useWorkbenchContext(): WorkbenchContextValue {
  const value = useContext(WorkbenchContext);
  if (!value) throw new Error('useWorkbenchContext must be used inside <WorkbenchContext.Provider>');
  return value;
}

/** Outside the workbench (e.g. a read-only preview) node views fall back to their stored attrs. */
export function useOptionalWorkbenchContext(): WorkbenchContextValue | null {
  return useContext(WorkbenchContext);
}

'use client';

import { Dialog } from '@/components/ui/Dialog';
import type { AppraisalDTO, MechanismDTO, ReviewDTO, StudyDTO } from '@/lib/reviews/types';
import type { AppraisalInput } from '@/lib/validation/appraisals';
import { AppraisalForm } from './lazy';

export type AppraisalDialogState =
  { mode: 'create'; mechanismId: number | null } | { mode: 'edit'; appraisal: AppraisalDTO } | null;

/** Appraising a study for a mechanism or the claimed outcome, or editing an appraisal. */
export function AppraisalDialog({
  appraisalDialog,
  review,
  mechanisms,
  studyList,
  libraryLoading,
  appraisals,
  onClose,
  onSave,
  onDelete,
}: {
  appraisalDialog: AppraisalDialogState;
  review: ReviewDTO;
  mechanisms: readonly MechanismDTO[];
  studyList: readonly StudyDTO[];
  libraryLoading: boolean;
  appraisals: readonly AppraisalDTO[];
  onClose: () => void;
  /** `appraisal` is the one edited, undefined for a new one. */
  onSave: (input: AppraisalInput, appraisal?: AppraisalDTO) => Promise<unknown>;
  onDelete: (appraisal: AppraisalDTO) => Promise<unknown>;
}) {
  return (
    <Dialog
      wide
      open={appraisalDialog !== null}
      onClose={onClose}
      title={appraisalDialog?.mode === 'edit' ? 'Edit the appraisal' : 'Appraise a study'}
      description="Certainty and applicability update as you change the form."
    >
      {appraisalDialog && (
        <AppraisalForm
          review={review}
          mechanisms={mechanisms}
          library={studyList}
          libraryLoading={libraryLoading}
          appraisals={appraisals}
          appraisal={appraisalDialog.mode === 'edit' ? appraisalDialog.appraisal : undefined}
          defaultMechanismId={
            appraisalDialog.mode === 'create' ? appraisalDialog.mechanismId : appraisalDialog.appraisal.mechanismId
          }
          onCancel={onClose}
          onSubmit={(input) => onSave(input, appraisalDialog.mode === 'edit' ? appraisalDialog.appraisal : undefined)}
          onDelete={appraisalDialog.mode === 'edit' ? () => onDelete(appraisalDialog.appraisal) : undefined}
        />
      )}
    </Dialog>
  );
}

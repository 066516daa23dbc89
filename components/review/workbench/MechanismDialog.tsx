'use client';

import { Dialog } from '@/components/ui/Dialog';
import type { MechanismDTO, ReviewDTO, VerdictMechanismDTO } from '@/lib/reviews/types';
import type { MechanismInput } from '@/lib/swr/use-review-mutations';
import { MECHANISM_KIND_LABEL, percent } from '../labels';
import { MechanismForm } from './lazy';

export type MechanismDialogState = { mode: 'create' } | { mode: 'edit'; id: number } | null;

/**
 * Adding or editing a candidate mechanism; a reader who may not edit sees its summary. A new
 * mechanism is handed back (`onCreated`) so the workbench can place its block in the text.
 */
export function MechanismDialog({
  mechanismDialog,
  editedMechanism,
  review,
  canEdit,
  score,
  onClose,
  onCreate,
  onUpdate,
  onDelete,
}: {
  mechanismDialog: MechanismDialogState;
  editedMechanism: MechanismDTO | undefined;
  review: ReviewDTO;
  canEdit: boolean;
  score: VerdictMechanismDTO | undefined;
  onClose: () => void;
  onCreate: (input: MechanismInput) => Promise<unknown>;
  onUpdate: (mechanism: MechanismDTO, input: MechanismInput) => Promise<unknown>;
  onDelete: (mechanism: MechanismDTO) => Promise<unknown>;
}) {
  return (
    <Dialog
      open={mechanismDialog !== null}
      onClose={onClose}
      title={mechanismDialog?.mode === 'edit' ? `Mechanism: ${editedMechanism?.name ?? ''}` : 'Add a mechanism'}
      description={
        mechanismDialog?.mode === 'create'
          ? 'It is placed in the text where the cursor was, and gets its own appraisals.'
          : canEdit
            ? undefined
            : 'Only its author or the team owner can change it.'
      }
    >
      {mechanismDialog?.mode === 'edit' && !editedMechanism ? (
        <p className="text-ink-muted text-sm">This mechanism no longer exists.</p>
      ) : canEdit || mechanismDialog?.mode === 'create' ? (
        <MechanismForm
          mechanism={editedMechanism}
          protocol={review.protocol}
          onCancel={onClose}
          onSubmit={async (input) => {
            if (mechanismDialog?.mode === 'edit' && editedMechanism) await onUpdate(editedMechanism, input);
            else await onCreate(input);
          }}
          onDelete={editedMechanism ? () => onDelete(editedMechanism) : undefined}
        />
      ) : editedMechanism ? (
        <MechanismSummary mechanism={editedMechanism} score={score} />
      ) : null}
    </Dialog>
  );
}

function MechanismSummary({ mechanism, score }: { mechanism: MechanismDTO; score?: VerdictMechanismDTO }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-sm">
      <dt className="font-semibold">Kind</dt>
      <dd>{MECHANISM_KIND_LABEL[mechanism.kind]}</dd>
      <dt className="font-semibold">Summary</dt>
      <dd>{mechanism.summary || '—'}</dd>
      <dt className="font-semibold">Probability</dt>
      <dd>{score ? `${percent(score.probability)} · ${score.term}` : '—'}</dd>
    </dl>
  );
}

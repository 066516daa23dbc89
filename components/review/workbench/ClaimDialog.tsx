'use client';

import type { ComponentProps } from 'react';
import { Dialog } from '@/components/ui/Dialog';
import type { ReviewDTO } from '@/lib/reviews/types';
import type { ClaimForm as EagerClaimForm } from '../ClaimForm';
import { ClaimForm } from './lazy';

/** Editing the claim, the protocol and the population of a review. */
export function ClaimDialog({
  open,
  review,
  onClose,
  onSubmitEdit,
}: {
  open: boolean;
  review: ReviewDTO;
  onClose: () => void;
  onSubmitEdit: NonNullable<ComponentProps<typeof EagerClaimForm>['onSubmitEdit']>;
}) {
  return (
    <Dialog
      wide
      open={open}
      onClose={onClose}
      title="Edit the claim and protocol"
      description="Changing the protocol changes the dose check, the suggested applicability and the verdict."
    >
      <ClaimForm review={review} onCancel={onClose} onSubmitEdit={onSubmitEdit} onSaved={onClose} />
    </Dialog>
  );
}

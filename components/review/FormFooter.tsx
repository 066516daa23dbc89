'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/Button';
import { Spinner } from '@/components/ui/Spinner';

/**
 * The bottom row of the workbench's dialog forms: save and cancel, and — for an existing row —
 * a delete that asks once more before it acts, so a slip of the mouse deletes nothing.
 */
export function FormFooter({
  busy,
  saveLabel,
  deleteLabel,
  deleteQuestion,
  onCancel,
  onDelete,
}: {
  busy: 'save' | 'delete' | null;
  saveLabel: string;
  deleteLabel: string;
  deleteQuestion: string;
  onCancel: () => void;
  onDelete?: () => void;
}) {
  const [confirming, setConfirming] = useState(false);
  return (
    <div className="border-line flex flex-wrap items-center justify-between gap-3 border-t pt-4">
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={busy !== null} aria-busy={busy === 'save' || undefined}>
          {busy === 'save' && <Spinner />}
          {saveLabel}
        </Button>
        <Button variant="secondary" onClick={onCancel} disabled={busy !== null}>
          Cancel
        </Button>
      </div>
      {onDelete &&
        (confirming ? (
          <div className="flex flex-wrap items-center gap-2" role="group" aria-label="Confirm deletion">
            <span className="text-danger-800 text-sm">{deleteQuestion}</span>
            <Button variant="danger" size="sm" onClick={onDelete} disabled={busy !== null}>
              {busy === 'delete' && <Spinner />}
              Yes, delete
            </Button>
            <Button variant="ghost" size="sm" onClick={() => setConfirming(false)} disabled={busy !== null}>
              Keep it
            </Button>
          </div>
        ) : (
          <Button variant="danger" size="sm" onClick={() => setConfirming(true)} disabled={busy !== null}>
            {deleteLabel}
          </Button>
        ))}
    </div>
  );
}

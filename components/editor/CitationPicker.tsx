'use client';

import Link from 'next/link';
import { Dialog } from '@/components/ui/Dialog';
import { StudyCombobox } from '@/components/library/StudyCombobox';
import type { StudyDTO } from '@/lib/reviews/types';

/** The dialog behind "Insert citation": pick a library study, the editor inserts "(Author, year)". */
export function CitationPicker({
  open,
  studies,
  loading,
  error,
  onPick,
  onClose,
}: {
  open: boolean;
  studies: readonly StudyDTO[];
  loading: boolean;
  error?: string;
  onPick: (study: StudyDTO) => void;
  onClose: () => void;
}) {
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title="Insert a citation"
      description="The citation is placed where the cursor was and shows author and year."
    >
      {error ? (
        <p
          role="alert"
          className="border-danger-100 bg-danger-50 text-danger-800 rounded-md border px-3 py-2.5 text-sm"
        >
          {error}
        </p>
      ) : (
        <StudyCombobox
          studies={studies}
          loading={loading}
          onPick={onPick}
          autoFocus
          label="Find a study in the library"
        />
      )}
      <p className="text-ink-muted mt-4 text-sm">
        Not there yet?{' '}
        <Link href="/library" className="prose-link" target="_blank">
          Add it to the library
        </Link>{' '}
        (opens in a new tab), then come back.
      </p>
    </Dialog>
  );
}

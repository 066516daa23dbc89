'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useSWRConfig } from 'swr';
import { Button } from '@/components/ui/Button';
import { Dialog } from '@/components/ui/Dialog';
import type { ReviewDTO } from '@/lib/reviews/types';
import { apiFetch, errorMessage } from '@/lib/swr/fetcher';
import { isReviewListKey } from '@/lib/swr/keys';

/** Asks before deleting the review; on success goes back to the list. */
export function DeleteReviewDialog({
  open,
  review,
  mechanismCount,
  appraisalCount,
  onClose,
}: {
  open: boolean;
  review: ReviewDTO;
  mechanismCount: number;
  appraisalCount: number;
  onClose: () => void;
}) {
  const router = useRouter();
  const { mutate } = useSWRConfig();
  const [deleteError, setDeleteError] = useState<string | null>(null);

  const deleteReview = async () => {
    setDeleteError(null);
    try {
      await apiFetch(`/api/reviews/${review.id}`, { method: 'DELETE' });
      void mutate(isReviewListKey);
      router.push('/reviews');
    } catch (error) {
      setDeleteError(errorMessage(error));
    }
  };

  return (
    <Dialog open={open} onClose={onClose} title="Delete this review?">
      <div className="space-y-4">
        <p>
          “{review.title}” will be deleted with its {mechanismCount} mechanism{mechanismCount === 1 ? '' : 's'} and{' '}
          {appraisalCount} appraisal{appraisalCount === 1 ? '' : 's'}. The studies stay in the library.
        </p>
        {deleteError && (
          <p role="alert" className="bg-danger-50 text-danger-800 rounded-md px-3 py-2 text-sm">
            {deleteError}
          </p>
        )}
        <div className="flex flex-wrap gap-2">
          <Button variant="danger" onClick={() => void deleteReview()}>
            Yes, delete the review
          </Button>
          <Button variant="secondary" onClick={onClose}>
            Keep it
          </Button>
        </div>
      </div>
    </Dialog>
  );
}

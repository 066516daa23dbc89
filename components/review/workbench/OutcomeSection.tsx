'use client';

import { AppraisalTable } from '@/components/appraisal/AppraisalTable';
import { Button } from '@/components/ui/Button';
import type { AppraisalDTO, StudyDTO } from '@/lib/reviews/types';
import { MetaAnalysisPanel } from './lazy';

/** The studies that test the claimed outcome directly, with their pooling when there are two or more. */
export function OutcomeSection({
  reviewId,
  appraisals,
  studies,
  canEdit,
  poolable,
  onAppraise,
  onEditAppraisal,
}: {
  reviewId: number;
  appraisals: AppraisalDTO[];
  studies: ReadonlyMap<number, StudyDTO>;
  canEdit: boolean;
  poolable: boolean;
  onAppraise: () => void;
  onEditAppraisal: (a: AppraisalDTO) => void;
}) {
  return (
    <section
      aria-labelledby="outcome-title"
      className="border-line bg-paper-raised shadow-card min-w-0 space-y-4 rounded-lg border px-5 py-4 lg:col-start-1"
    >
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="space-y-1">
          <h2 id="outcome-title" className="text-lg font-semibold">
            The claimed outcome itself
          </h2>
          <p className="text-ink-muted text-sm">
            Studies that test the promised result directly, whatever the reason for it.
          </p>
        </div>
        {canEdit && (
          <Button variant="secondary" size="sm" onClick={onAppraise}>
            Appraise a study for the outcome
          </Button>
        )}
      </div>
      <AppraisalTable
        appraisals={appraisals}
        studies={studies}
        caption="Appraisals of the claimed outcome"
        canEdit={canEdit}
        onEdit={onEditAppraisal}
      />
      {poolable && (
        <div className="border-line border-t pt-4">
          <h3 className="mb-3 text-base font-semibold">Meta-analysis</h3>
          <MetaAnalysisPanel reviewId={reviewId} target="outcome" subject="the claimed outcome" />
        </div>
      )}
    </section>
  );
}

'use client';

import { AppraisalTable } from '@/components/appraisal/AppraisalTable';
import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import type { AppraisalDTO, MechanismDTO, StudyDTO, VerdictMechanismDTO } from '@/lib/reviews/types';
import { MECHANISM_KIND_LABEL, percent } from '../labels';
import { MetaAnalysisPanel } from './lazy';
import { priorShift } from '../prior-shift';

/** One candidate mechanism: its probability, its appraisals and, with two or more, their pooling. */
export function MechanismCard({
  mechanism,
  score,
  appraisals,
  studies,
  canEdit,
  inText,
  poolable,
  reviewId,
  onEdit,
  onAppraise,
  onEditAppraisal,
  onPlace,
}: {
  mechanism: MechanismDTO;
  score?: VerdictMechanismDTO;
  appraisals: AppraisalDTO[];
  studies: ReadonlyMap<number, StudyDTO>;
  canEdit: boolean;
  inText: boolean;
  poolable: boolean;
  reviewId: number;
  onEdit: () => void;
  onAppraise: () => void;
  onEditAppraisal: (a: AppraisalDTO) => void;
  onPlace?: () => void;
}) {
  const headingId = `mechanism-${mechanism.id}-title`;
  return (
    <article
      aria-labelledby={headingId}
      data-testid="mechanism-card"
      className="border-line bg-paper-raised shadow-card space-y-4 rounded-lg border px-5 py-4"
    >
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0 space-y-1">
          <p className="text-granite-700 flex flex-wrap items-center gap-2 text-xs font-semibold tracking-wide uppercase">
            {MECHANISM_KIND_LABEL[mechanism.kind]}
            {mechanism.stated && <Badge tone="accent">Named by the claim</Badge>}
            {!inText && <Badge>Not in the text</Badge>}
          </p>
          <h3 id={headingId} className="text-lg font-semibold">
            {mechanism.name}
          </h3>
          <p className="text-ink-muted text-sm">
            {score ? (
              <>
                <strong className="text-ink tabular-nums">{percent(score.probability)}</strong> · {score.term}
                <span className="block text-xs" data-testid="prior-shift">
                  {priorShift({
                    prior: mechanism.prior,
                    logOdds: score.logOdds,
                    dosePenalty: score.dosePenalty,
                    appraised: appraisals.length,
                  })}
                </span>
              </>
            ) : (
              'Not scored yet'
            )}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          {canEdit && (
            <Button variant="secondary" size="sm" onClick={onAppraise}>
              Appraise a study
            </Button>
          )}
          <Button
            variant="ghost"
            size="sm"
            onClick={onEdit}
            aria-label={`${canEdit ? 'Edit' : 'View'} mechanism ${mechanism.name}`}
          >
            {canEdit ? 'Edit' : 'Details'}
          </Button>
          {!inText && onPlace && (
            <Button variant="ghost" size="sm" onClick={onPlace}>
              Place in text
            </Button>
          )}
        </div>
      </div>
      {mechanism.summary && <p className="text-sm">{mechanism.summary}</p>}
      <AppraisalTable
        appraisals={appraisals}
        studies={studies}
        caption={`Appraisals for ${mechanism.name}`}
        canEdit={canEdit}
        onEdit={onEditAppraisal}
      />
      {poolable && (
        <div className="border-line border-t pt-4">
          <h4 className="mb-3 text-base font-semibold">Meta-analysis</h4>
          <MetaAnalysisPanel reviewId={reviewId} target={mechanism.id} subject={mechanism.name} />
        </div>
      )}
    </article>
  );
}

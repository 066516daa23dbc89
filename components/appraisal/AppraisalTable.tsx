'use client';

import Link from 'next/link';
import { NoticeBadge } from '@/components/library/NoticeBadge';
import { Button } from '@/components/ui/Button';
import { cn } from '@/components/ui/cn';
import { CERTAINTY_LABEL, DESIGN_LABEL, DIRECTION_LABEL, percent } from '@/components/review/labels';
import type { AppraisalDTO, Direction, StudyDTO } from '@/lib/reviews/types';
import { NeedsCheckFlag } from './NeedsCheck';

const DIRECTION_MARK: Record<Direction, { mark: string; className: string }> = {
  supports: { mark: '▲', className: 'text-success-700' },
  against: { mark: '▼', className: 'text-danger-700' },
  neutral: { mark: '◆', className: 'text-ink-muted' },
};

/**
 * The appraisals of one mechanism (or of the claimed outcome). Direction carries a shape as well
 * as a colour, so it reads in greyscale and for colour-blind readers.
 */
export function AppraisalTable({
  appraisals,
  studies,
  caption,
  canEdit,
  onEdit,
}: {
  appraisals: readonly AppraisalDTO[];
  studies: ReadonlyMap<number, StudyDTO>;
  caption: string;
  canEdit: boolean;
  onEdit: (appraisal: AppraisalDTO) => void;
}) {
  if (appraisals.length === 0) {
    return <p className="text-ink-muted text-sm">No studies appraised for this yet.</p>;
  }
  return (
    <div className="relative -mx-5 overflow-x-auto px-5">
      <table className="w-full min-w-[34rem] border-collapse text-sm" data-testid="appraisal-table">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-line-strong text-ink-muted border-b text-left text-xs tracking-wide uppercase">
            <th scope="col" className="py-2 pr-3 font-semibold">
              Study
            </th>
            <th scope="col" className="py-2 pr-3 font-semibold">
              Design
            </th>
            <th scope="col" className="py-2 pr-3 font-semibold">
              Certainty
            </th>
            <th scope="col" className="py-2 pr-3 font-semibold">
              Direction
            </th>
            <th scope="col" className="py-2 pr-3 text-right font-semibold">
              Applicability
            </th>
            {canEdit && (
              <th scope="col" className="py-2 font-semibold">
                <span className="sr-only">Actions</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {appraisals.map((a) => {
            const study = studies.get(a.studyId);
            const direction = DIRECTION_MARK[a.direction];
            return (
              <tr key={a.id} className="border-line border-b align-top last:border-b-0" data-testid="appraisal-row">
                <th scope="row" className="w-[38%] py-2.5 pr-3 text-left font-normal">
                  {study ? (
                    <>
                      <Link href={`/library/${study.id}`} className="text-brand font-semibold hover:underline">
                        {study.citation}
                      </Link>
                      <span className="text-ink-muted line-clamp-2 block text-xs" title={study.title}>
                        {study.title}
                      </span>
                      <NoticeBadge notice={study.notice} />
                    </>
                  ) : (
                    <span className="text-ink-muted">Study #{a.studyId}</span>
                  )}
                  {study?.effect && <span className="text-granite-700 mt-0.5 block text-xs">Has an effect size</span>}
                </th>
                <td className="py-2.5 pr-3">{study?.design ? DESIGN_LABEL[study.design] : '—'}</td>
                <td
                  className="py-2.5 pr-3 font-semibold"
                  data-testid="appraisal-certainty"
                  data-certainty={a.certainty}
                >
                  {CERTAINTY_LABEL[a.certainty]}
                  {a.needsCheck && (
                    <span className="mt-1 block font-normal">
                      <NeedsCheckFlag />
                    </span>
                  )}
                </td>
                <td className="py-2.5 pr-3">
                  <span aria-hidden="true" className={cn('mr-1', direction.className)}>
                    {direction.mark}
                  </span>
                  {DIRECTION_LABEL[a.direction]}
                  {a.directionReason && (
                    <span className="text-ink-muted block text-xs" title={a.directionReason}>
                      against the effect’s suggestion, with a reason
                    </span>
                  )}
                </td>
                <td className="py-2.5 pr-3 text-right tabular-nums">
                  {percent(a.applicability)}
                  {a.applicabilityOverride != null && (
                    <span className="text-ink-muted block text-xs" title={a.overrideReason ?? undefined}>
                      set by hand
                    </span>
                  )}
                </td>
                {canEdit && (
                  <td className="py-1.5 text-right">
                    <Button
                      variant="ghost"
                      size="sm"
                      onClick={() => onEdit(a)}
                      aria-label={`Edit the appraisal of ${study?.citation ?? `study ${a.studyId}`}`}
                    >
                      Edit
                    </Button>
                  </td>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

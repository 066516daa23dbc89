import { Badge } from '@/components/ui/Badge';
import { formatNoticeDate, NOTICE_KINDS, noticeLine, type EvidenceNotice } from '@/lib/watch/notices';

/**
 * A study's update notice where the study is named (library rows, appraisal tables): the kind
 * and date on the badge, the notice's DOI beside it. Retractions and withdrawals read as danger,
 * concerns and corrections as warnings.
 */
export function NoticeBadge({ notice, withDoi = true }: { notice: EvidenceNotice | null; withDoi?: boolean }) {
  if (!notice) return null;
  const { label, severity } = NOTICE_KINDS[notice.kind];
  return (
    <span className="inline-flex flex-wrap items-center gap-1.5 text-xs" data-testid="study-notice">
      <Badge tone={severity >= 3 ? 'danger' : 'warning'}>
        <span title={noticeLine(notice)}>
          {label}
          {notice.date ? ` ${formatNoticeDate(notice.date)}` : ''}
        </span>
      </Badge>
      {withDoi && (
        <a
          className="text-ink-muted break-all underline"
          href={`https://doi.org/${notice.noticeDoi}`}
          target="_blank"
          rel="noreferrer noopener"
        >
          notice doi:{notice.noticeDoi}
        </a>
      )}
    </span>
  );
}

/** The study page's banner: what the notice means for the appraisals that use the study. */
export function NoticeBanner({ notice }: { notice: EvidenceNotice | null }) {
  if (!notice) return null;
  const { past, severity } = NOTICE_KINDS[notice.kind];
  return (
    <div
      role="note"
      data-testid="study-notice-banner"
      className={
        severity >= 3
          ? 'border-danger-100 bg-danger-50 text-danger-800 rounded-lg border px-4 py-3'
          : 'border-warning-100 bg-warning-50 text-warning-800 rounded-lg border px-4 py-3'
      }
    >
      <p className="font-semibold">
        This study was {past}
        {notice.date ? ` on ${formatNoticeDate(notice.date)}` : ''}.
      </p>
      <p className="mt-1 text-sm">
        Notice:{' '}
        <a
          className="break-all underline"
          href={`https://doi.org/${notice.noticeDoi}`}
          target="_blank"
          rel="noreferrer noopener"
        >
          doi:{notice.noticeDoi}
        </a>
        . Re-check the appraisals that use it; published verdicts citing it are flagged “evidence changed”.
      </p>
    </div>
  );
}

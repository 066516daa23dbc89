import type { EvidenceChangedDTO } from '@/lib/publishing/types';
import { formatNoticeDate, NOTICE_KINDS } from '@/lib/watch/notices';

/**
 * Above the verdict, while the evidence watch has a study of this version under a notice: what
 * happened to which study, and that the team is re-reviewing. Gone once a new version is out.
 */
export function EvidenceChangedNotice({ notices }: { notices: EvidenceChangedDTO[] }) {
  if (!notices.length) return null;
  return (
    <div
      role="note"
      aria-labelledby="evidence-changed-heading"
      data-testid="evidence-changed"
      className="border-danger-100 bg-danger-50 text-danger-800 rounded-lg border px-4 py-3"
    >
      <p id="evidence-changed-heading" className="font-semibold">
        The evidence behind this verdict changed.
      </p>
      <ul className="mt-1 space-y-1">
        {notices.map((n) => (
          <li key={`${n.citation} ${n.noticeDoi}`}>
            A cited study ({n.citation}) was {NOTICE_KINDS[n.kind].past}
            {n.date ? ` on ${formatNoticeDate(n.date)}` : ''} (notice{' '}
            <a className="break-all underline" href={`https://doi.org/${n.noticeDoi}`} rel="nofollow noopener">
              doi:{n.noticeDoi}
            </a>
            ).
          </li>
        ))}
      </ul>
      <p className="mt-1 text-sm">
        The team is re-reviewing this verdict; until a new version is published, read it with that in mind.
      </p>
    </div>
  );
}

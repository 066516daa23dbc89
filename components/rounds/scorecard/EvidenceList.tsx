'use client';

import { DIRECTION_LABEL } from '@/components/review/labels';
import { Badge } from '@/components/ui/Badge';
import type { Concern, Direction } from '@/lib/reviews/types';
import type { ScorecardViewDTO } from '@/lib/rounds/types';
import { CONCERN_INFO, DOMAIN_INFO, DOWNGRADE_DOMAINS } from '@/lib/scoring/appraisal-vocabulary';

/** The author's appraisals as entered (direction and concerns), never the engine's numbers. */
export function EvidenceList({
  evidence,
  studyById,
}: {
  evidence: ScorecardViewDTO['appraisals'];
  studyById: Map<number, ScorecardViewDTO['studies'][number]>;
}) {
  if (!evidence.length) return <p className="text-ink-muted text-sm">No studies appraised for this yet.</p>;
  return (
    <ul className="space-y-2">
      {evidence.map((a) => {
        const s = studyById.get(a.studyId);
        const concerns = DOWNGRADE_DOMAINS.filter((d) => a[d] !== 'none').map(
          (d) => `${DOMAIN_INFO[d].label.toLowerCase()}: ${CONCERN_INFO[a[d] as Concern]?.label.toLowerCase() ?? a[d]}`,
        );
        return (
          <li key={a.id} className="border-line rounded-md border px-3 py-2 text-sm">
            <p>
              <span className="font-semibold">{s?.citation ?? 'Unknown study'}</span>{' '}
              <Badge tone={a.direction === 'supports' ? 'brand' : a.direction === 'against' ? 'accent' : 'neutral'}>
                {DIRECTION_LABEL[a.direction as Direction]?.toLowerCase() ?? a.direction}
              </Badge>
            </p>
            {s && (
              <p className="text-ink-muted">
                {s.title}
                {s.design && ` · ${s.design}`}
                {s.n !== null && ` · n = ${s.n}`}
                {s.population && ` · ${s.population}`}
                {s.intensity !== null && ` · ${Math.round(s.intensity * 100)} % of max`}
              </p>
            )}
            <p className="text-ink-muted">
              {concerns.length ? `Author’s concerns: ${concerns.join('; ')}` : 'No certainty concerns recorded.'}
            </p>
            {a.notes && <p className="mt-1">{a.notes}</p>}
            {a.directionReason && (
              <p className="mt-1">Direction differs from the study’s effect because: {a.directionReason}</p>
            )}
          </li>
        );
      })}
    </ul>
  );
}

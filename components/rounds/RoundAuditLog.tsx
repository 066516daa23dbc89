import { LocalTime } from '@/components/review/LocalTime';
import type { RoundAuditDTO } from '@/lib/rounds/types';
import { AUDIT_LABEL } from './labels';

/** The round events of this review from the audit log (owner only): who did what, when. */
export function RoundAuditLog({ events }: { events: RoundAuditDTO[] }) {
  return (
    <section aria-labelledby="round-audit" className="space-y-3">
      <h2 id="round-audit" className="text-xl font-semibold">
        Audit log
      </h2>
      {events.length === 0 ? (
        <p className="text-ink-muted text-sm">No round events yet.</p>
      ) : (
        <ol className="border-line bg-paper-raised divide-line divide-y rounded-lg border text-sm">
          {events.map((e) => (
            <li key={e.id} className="flex flex-wrap justify-between gap-x-4 gap-y-1 px-4 py-2.5">
              <span>
                <span className="font-semibold">{e.actorName}</span> {AUDIT_LABEL[e.action] ?? e.action}
                {typeof e.data?.roundId === 'number' && (
                  <span className="text-ink-muted"> · round {e.data.roundId}</span>
                )}
              </span>
              <span className="text-ink-muted">
                <LocalTime iso={e.at} />
              </span>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}

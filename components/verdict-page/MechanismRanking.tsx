import type { SnapshotMechanism } from '@/lib/publishing/types';
import { percent } from './labels';

const KIND_WORDS: Record<string, string> = {
  physiological: 'a change in the body',
  perceptual: 'how it feels and how safe it seems',
  skill: 'skill and technique',
  'non-specific': 'other things that change at the same time',
};

/**
 * The candidate mechanisms, most important first, each with its likelihood in words and a bar
 * of its share of the expected effect. The bar is decoration: the share is also written out.
 */
export function MechanismRanking({ mechanisms }: { mechanisms: SnapshotMechanism[] }) {
  if (!mechanisms.length) return <p className="text-ink-muted">No mechanisms were weighed for this claim.</p>;
  return (
    <ol className="space-y-4">
      {mechanisms.map((m) => (
        <li
          key={m.id}
          id={`mechanism-${m.id}`}
          className="border-line bg-paper-raised break-inside-avoid rounded-lg border p-4"
        >
          <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
            <h3 className="text-lg font-semibold">
              <span className="text-ink-muted mr-1.5 font-normal">{m.rank}.</span>
              {m.name}
            </h3>
            <p className="text-sm font-semibold">
              {m.term.charAt(0).toUpperCase() + m.term.slice(1)}
              <span className="text-ink-muted font-normal"> ({percent(m.probability)})</span>
            </p>
          </div>
          <p className="text-ink-muted mt-0.5 text-sm">
            Works through {KIND_WORDS[m.kind] ?? m.kind}
            {m.stated ? ' · the reason the claim itself gives' : ''}
          </p>
          {m.summary && <p className="mt-2">{m.summary}</p>}
          <div className="mt-3">
            <p className="text-sm">
              Share of the expected effect: <strong>{percent(m.share)}</strong>
            </p>
            <div
              className="bg-chalk-200 mt-1 h-2.5 overflow-hidden rounded-full [print-color-adjust:exact]"
              aria-hidden="true"
            >
              <div
                className="bg-granite-600 h-full rounded-full"
                style={{ width: `${Math.max(1, Math.round(m.share * 100))}%` }}
              />
            </div>
          </div>
          {m.dosePenalty > 0 && (
            <p className="text-warning-800 mt-2 text-sm">
              The protocol’s load or effort is below what this mechanism needs, which lowers its chances.
            </p>
          )}
        </li>
      ))}
    </ol>
  );
}

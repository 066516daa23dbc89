import type { SnapshotRobustness } from '@/lib/publishing/types';

/**
 * What the verdict rests on and what would change it, as the version's snapshot wrote it at
 * publish time (lib/publishing/robustness-plain.ts). Plain server-rendered text: no script.
 */
export function VerdictFirmness({ robustness }: { robustness: SnapshotRobustness }) {
  return (
    <div className="space-y-2" data-testid="verdict-firmness">
      <p>{robustness.restsOn}</p>
      <p>{robustness.wouldChange}</p>
      <p className="text-ink-muted text-sm">
        A verdict is the team’s reading of the evidence as it stood when this version was published; new or withdrawn
        studies can change it.
      </p>
    </div>
  );
}

import { LIKELIHOOD_BANDS, likelihoodBand } from '@/lib/scoring/likelihood';
import { cn } from '@/components/ui/cn';

/**
 * The seven likelihood bands as a strip with the probability marked on it, so the words and the
 * number are read together. Bands are drawn at their true widths on 0…1, which is why the two
 * extreme bands are thin: "virtually certain" really is a narrow place.
 */
export function LikelihoodScale({ probability, className }: { probability: number; className?: string }) {
  const band = likelihoodBand(probability);
  return (
    <div className={cn('space-y-1', className)} aria-hidden="true">
      <div className="bg-chalk-200 relative flex h-2.5 overflow-hidden rounded-full">
        {LIKELIHOOD_BANDS.map((b, i) => (
          <span
            key={b.term}
            style={{ width: `${(b.max - b.min) * 100}%` }}
            className={cn(
              'border-paper-raised h-full border-r last:border-r-0',
              i === band ? 'bg-granite-600' : 'bg-chalk-200',
            )}
          />
        ))}
      </div>
      <div className="relative h-2">
        <span
          className="border-b-rope-500 absolute top-0 -ml-1.5 block size-0 border-x-[6px] border-b-[8px] border-x-transparent"
          style={{ left: `${Math.min(100, Math.max(0, probability * 100))}%` }}
        />
      </div>
      <div className="text-ink-muted flex justify-between text-[0.7rem]">
        <span>exceptionally unlikely</span>
        <span>virtually certain</span>
      </div>
    </div>
  );
}

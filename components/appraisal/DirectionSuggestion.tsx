'use client';

import { Button } from '@/components/ui/Button';
import { TextAreaField } from '@/components/ui/Field';
import { DIRECTION_LABEL } from '@/components/review/labels';
import type { Direction } from '@/lib/reviews/types';
import type { SuggestedDirection } from '@/lib/scoring/direction';

/**
 * The direction the study's effect on this target suggests (docs/scoring.md §10), beside the
 * coach's choice: one click takes it; choosing another asks for the reason, which reviewers
 * and the working show.
 */
export function DirectionSuggestion({
  suggested,
  direction,
  reason,
  onUse,
  onReason,
  errors,
}: {
  suggested: SuggestedDirection | null;
  direction: Direction;
  reason: string;
  onUse: (direction: Direction) => void;
  onReason: (reason: string) => void;
  errors?: string[];
}) {
  if (suggested === null) {
    return (
      <p className="text-ink-muted text-sm" data-testid="direction-suggestion">
        The study has no effect size in the library, so there is no direction to suggest: judge it from the paper.
      </p>
    );
  }
  const differs = suggested !== direction;
  return (
    <div className="space-y-3" data-testid="direction-suggestion" data-suggested={suggested}>
      <p className="flex flex-wrap items-center gap-2 text-sm">
        <span>
          The study’s effect suggests <strong>{DIRECTION_LABEL[suggested].toLowerCase()}</strong>
          <span className="text-ink-muted"> (from its 95 % interval, with the target’s better direction)</span>.
        </span>
        {differs && (
          <Button size="sm" variant="secondary" onClick={() => onUse(suggested)}>
            Use the suggestion
          </Button>
        )}
      </p>
      {differs && (
        <TextAreaField
          label="Why a different direction?"
          name="directionReason"
          help="Reviewers see it, and so does the working. For example: the effect reported is a different measure."
          rows={2}
          value={reason}
          onChange={(e) => onReason(e.target.value)}
          errors={errors}
        />
      )}
    </div>
  );
}

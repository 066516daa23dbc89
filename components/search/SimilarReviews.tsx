'use client';

import Link from 'next/link';
import { useActionState, useDeferredValue } from 'react';
import { copyMechanismAction } from '@/app/(app)/search/actions';
import { Badge } from '@/components/ui/Badge';
import { SubmitButton } from '@/components/ui/SubmitButton';
import type { FormState } from '@/lib/auth/action';
import { useSearch } from '@/lib/swr/use-search';
import { useWorkbench } from '@/lib/swr/use-workbench';
import { Highlight } from './Highlight';

/**
 * Past reviews like the claim being typed, under the claim form (and in a new review, with
 * their mechanisms to copy). Quiet until a few words are typed; a failed lookup shows nothing
 * rather than getting in the way of writing.
 */
export function SimilarReviews({
  teamId,
  claim,
  targetReviewId,
}: {
  teamId: number;
  claim: string;
  targetReviewId?: number;
}) {
  const q = useDeferredValue(claim.trim());
  const params =
    q.length >= 8
      ? new URLSearchParams({ kind: 'review', limit: '5', teamId: String(teamId), q: q.slice(0, 200) })
      : null;
  const { data } = useSearch(params);
  const results = (data?.results ?? []).filter((r) => r.id !== targetReviewId && r.score < 0.6);
  if (!params || !results.length) return null;
  return (
    <section aria-labelledby="similar-heading" className="border-line bg-paper-sunken rounded-lg border p-4">
      <h2 id="similar-heading" className="font-semibold">
        Similar past reviews
      </h2>
      <p className="text-ink-muted text-sm">
        Your team may have weighed this before: reuse its mechanisms and evidence.
      </p>
      <ul className="mt-3 space-y-3">
        {results.map((r) => (
          <li key={r.id}>
            <Link href={r.href} className="font-semibold hover:underline">
              <Highlight text={r.title} field="title" matches={r.matches} />
            </Link>
            {r.verdict && <Badge className="ml-2">{r.verdict}</Badge>}
            <p className="text-ink-muted text-sm">
              <Highlight text={r.detail} field="claim" matches={r.matches} />
            </p>
            {targetReviewId && <MechanismsToCopy sourceReviewId={r.id} targetReviewId={targetReviewId} />}
          </li>
        ))}
      </ul>
    </section>
  );
}

function MechanismsToCopy({ sourceReviewId, targetReviewId }: { sourceReviewId: number; targetReviewId: number }) {
  // The workbench read of the past review (staff only, like this panel), for its mechanisms.
  const { data } = useWorkbench(sourceReviewId);
  const mechanisms = data?.mechanisms ?? [];
  if (!mechanisms.length) return null;
  return (
    <ul className="mt-1 space-y-1 pl-4">
      {mechanisms.map((m) => (
        <li key={m.id}>
          <CopyForm mechanismId={m.id} name={m.name} sourceReviewId={sourceReviewId} targetReviewId={targetReviewId} />
        </li>
      ))}
    </ul>
  );
}

function CopyForm(props: { mechanismId: number; name: string; sourceReviewId: number; targetReviewId: number }) {
  const [state, action] = useActionState<FormState, FormData>(copyMechanismAction, {});
  return (
    <form action={action} className="flex flex-wrap items-center gap-2 text-sm">
      <input type="hidden" name="mechanismId" value={props.mechanismId} />
      <input type="hidden" name="sourceReviewId" value={props.sourceReviewId} />
      <input type="hidden" name="targetReviewId" value={props.targetReviewId} />
      <span>{props.name}</span>
      <SubmitButton size="sm" variant="secondary" aria-label={`Copy “${props.name}” with its appraisals`}>
        Copy
      </SubmitButton>
      <span aria-live="polite" className="text-ink-muted">
        {state.message}
      </span>
    </form>
  );
}

'use client';

import { toEditorContent } from '@/components/editor/body';
import { BodyPreviewFrame } from '@/components/editor/BodyPreview';
import type { ReviewDTO } from '@/lib/reviews/types';

/**
 * The review text for someone who cannot edit it now (a reader, or anyone while a round has the
 * review frozen): the editor's frame and the editor's look, without creating an editor — no
 * ProseMirror view, no node views — which is most of the work a workbench page does in the
 * browser (docs/architecture.md, "The workbench's weight"). Mechanism blocks open the mechanism
 * as they do in the editor.
 */
export function ReviewText({ review }: { review: ReviewDTO }) {
  return (
    <section aria-labelledby="review-body-title" className="border-line bg-paper-raised shadow-card rounded-lg border">
      <div className="border-line flex flex-wrap items-center justify-between gap-2 border-b px-5 py-3">
        <h2 id="review-body-title" className="text-lg font-semibold">
          Analysis
        </h2>
      </div>
      <BodyPreviewFrame body={toEditorContent(review.body)} busy={false} />
    </section>
  );
}

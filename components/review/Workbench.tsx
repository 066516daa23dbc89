'use client';

import type { Editor } from '@tiptap/react';
import { notFound } from 'next/navigation';
import { Suspense, useCallback, useMemo, useState } from 'react';
import { SWRConfig, useSWRConfig } from 'swr';
import { ReviewEditor } from '@/components/editor/ReviewEditor';
import { ReviewSaver } from '@/components/editor/review-saver';
import { Button } from '@/components/ui/Button';
import { VerdictPanel } from '@/components/verdict/VerdictPanel';
import { decide, type Actor } from '@/lib/auth/policy';
import type { VerdictDTO, WorkbenchDTO } from '@/lib/reviews/types';
import { isReviewListKey, keys } from '@/lib/swr/keys';
import { useLibrary } from '@/lib/swr/use-library';
import { useReviewMutations } from '@/lib/swr/use-review-mutations';
import { useVerdict } from '@/lib/swr/use-verdict';
import { useWorkbench } from '@/lib/swr/use-workbench';
import { RoundStatusBadge } from '@/components/rounds/RoundStatusBadge';
import { roundsKey, useReviewFrozen, type RoundList } from '@/lib/swr/use-rounds';
import { ReviewHeader } from './ReviewHeader';
import type { ViewerProps } from './viewer';
import { AppraisalDialog, type AppraisalDialogState } from './workbench/AppraisalDialog';
import { ClaimDialog } from './workbench/ClaimDialog';
import { DeleteReviewDialog } from './workbench/DeleteReviewDialog';
import { DoseCheckPanel, PublishPanel, RecommendationsPanel, SimilarReviews } from './workbench/lazy';
import { MechanismCard } from './workbench/MechanismCard';
import { MechanismDialog, type MechanismDialogState } from './workbench/MechanismDialog';
import { OutcomeSection } from './workbench/OutcomeSection';
import { ReviewText } from './workbench/ReviewText';
import { usePlacedMechanisms } from './workbench/use-placed-mechanisms';
import { useWorkbenchMaps } from './workbench/use-workbench-maps';
import { WorkbenchSkeleton } from './workbench/WorkbenchSkeleton';
import { WorkbenchContext, type WorkbenchContextValue } from './workbench-context';

type Viewer = ViewerProps;

/**
 * What the server read for the first view besides the review itself: the verdict and the peer
 * review rounds. Handed to SWR as fallback, so the first HTML already has the verdict panel,
 * the mechanisms' probabilities and the round notice at their final size — nothing fetched after
 * hydration pushes the page around (docs/architecture.md, "The workbench's weight").
 */
export interface WorkbenchFirstView {
  verdict?: VerdictDTO;
  rounds?: RoundList;
}

/** The review workbench: loads the review, then hands it to the editor and panels. */
export function Workbench({
  reviewId,
  viewer,
  fallback,
  firstView,
}: {
  reviewId: number;
  viewer: Viewer;
  fallback?: WorkbenchDTO;
  firstView?: WorkbenchFirstView;
}) {
  const swrFallback = useMemo(() => {
    const entries: Record<string, unknown> = {};
    if (firstView?.verdict) entries[keys.verdict(reviewId)] = firstView.verdict;
    if (firstView?.rounds) entries[roundsKey(reviewId)] = firstView.rounds;
    return { fallback: entries };
  }, [firstView, reviewId]);
  return (
    <SWRConfig value={swrFallback}>
      <WorkbenchData reviewId={reviewId} viewer={viewer} fallback={fallback} />
    </SWRConfig>
  );
}

function WorkbenchData({ reviewId, viewer, fallback }: { reviewId: number; viewer: Viewer; fallback?: WorkbenchDTO }) {
  const { data, error, mutate } = useWorkbench(reviewId, fallback);
  if (error?.status === 404) notFound();
  if (error && !data) {
    return (
      <div
        role="alert"
        className="max-w-measure border-danger-100 bg-paper-raised shadow-card mx-auto space-y-3 rounded-lg border px-6 py-8"
      >
        <h1 className="text-2xl font-semibold">This review could not be loaded</h1>
        <p className="text-ink-muted">{error.message}</p>
        <Button onClick={() => void mutate()}>Try again</Button>
      </div>
    );
  }
  if (!data) return <WorkbenchSkeleton />;
  return <LoadedWorkbench key={data.review.id} data={data} viewer={viewer} />;
}

function LoadedWorkbench({ data, viewer }: { data: WorkbenchDTO; viewer: Viewer }) {
  const { mutate } = useSWRConfig();
  const { review, appraisals } = data;
  const reviewId = review.id;
  const mutations = useReviewMutations(reviewId);
  const verdict = useVerdict(reviewId);
  // The whole team library feeds the citation picker and the appraisal form only: it is read the
  // first time one of them opens, not with the page (it can be thousands of studies).
  const [libraryWanted, setLibraryWanted] = useState(false);
  const library = useLibrary(libraryWanted ? review.teamId : null);
  // While a peer-review round is open the review is frozen (the server answers 409 as well).
  const frozen = useReviewFrozen(reviewId);
  // One saver for every PATCH of this review (body autosave and claim edits share the version).
  const [saver] = useState(() => new ReviewSaver(reviewId, review.version));
  const [editor, setEditor] = useState<Editor | null>(null);
  const [mechanismDialog, setMechanismDialog] = useState<MechanismDialogState>(null);
  const [appraisalDialog, setAppraisalDialogState] = useState<AppraisalDialogState>(null);
  const setAppraisalDialog = useCallback((state: AppraisalDialogState) => {
    if (state) setLibraryWanted(true);
    setAppraisalDialogState(state);
  }, []);
  const [editingClaim, setEditingClaim] = useState(false);
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);

  const actor: Actor = useMemo(() => ({ userId: viewer.userId, roles: new Map(viewer.roles) }), [viewer]);
  // The same policy module the route handlers use; the server still checks every write.
  const canEdit =
    !frozen && decide(actor, 'review.update', { teamId: review.teamId, authorId: review.authorId }) === 'allow';
  // The editor is created only for someone who can edit, and kept from then on (a round opening
  // while they type leaves their text in place, read-only); everyone else reads the same text
  // without an editor behind it.
  const [editorWanted, setEditorWanted] = useState(canEdit);
  if (canEdit && !editorWanted) setEditorWanted(true);
  const canDelete = decide(actor, 'review.delete', { teamId: review.teamId, authorId: review.authorId }) === 'allow';

  const { mechanisms, mechanismMap, studyMap, studyList, scores, byTarget } = useWorkbenchMaps(
    data,
    library.data,
    verdict.data,
  );

  const openMechanism = useCallback((id: number) => setMechanismDialog({ mode: 'edit', id }), []);
  const context: WorkbenchContextValue = useMemo(
    () => ({
      reviewId,
      review,
      mechanisms: mechanismMap,
      studies: studyMap,
      scores,
      verdictLoading: verdict.isLoading,
      canEdit,
      openMechanism,
    }),
    [reviewId, review, mechanismMap, studyMap, scores, verdict.isLoading, canEdit, openMechanism],
  );

  const placed = usePlacedMechanisms(editor, review.body);

  // The server says where two or more compatible effect sizes exist (it knows the measures).
  const poolable = (mechanismId: number | null) =>
    (data.poolable ?? []).some((p) => p.mechanismId === mechanismId && p.k >= 2);

  const insertBlock = (id: number) => {
    // After the dialog has closed and handed focus back, place the block at the cursor.
    requestAnimationFrame(() => {
      editor?.chain().focus().insertMechanismBlock(id).run();
    });
  };

  const editedMechanism = mechanismDialog?.mode === 'edit' ? mechanismMap.get(mechanismDialog.id) : undefined;

  return (
    <WorkbenchContext.Provider value={context}>
      <ReviewHeader
        review={review}
        canEdit={canEdit}
        onEdit={() => setEditingClaim(true)}
        onDelete={() => (canDelete ? setConfirmingDelete(true) : undefined)}
      />
      <RoundStatusBadge reviewId={reviewId} />
      {notice && (
        <p
          role="status"
          className="border-success-100 bg-success-50 text-success-800 mb-4 flex items-center justify-between gap-2 rounded-md border px-4 py-2.5 text-sm"
        >
          {notice}
          <button type="button" className="font-semibold underline" onClick={() => setNotice(null)}>
            Dismiss
          </button>
        </p>
      )}

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem] xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="min-w-0 lg:col-start-1">
          {editorWanted ? (
            <ReviewEditor
              review={review}
              saver={saver}
              editable={canEdit}
              library={studyList}
              libraryLoading={library.isLoading}
              libraryError={library.error ? `The library could not be loaded: ${library.error.message}` : undefined}
              onAddMechanism={() => setMechanismDialog({ mode: 'create' })}
              onPickCitation={() => setLibraryWanted(true)}
              onEditor={setEditor}
            />
          ) : (
            <ReviewText review={review} />
          )}
        </div>

        {/* On a phone the verdict follows the text; on a desktop it stays in view below the
            sticky app header while the page scrolls, and scrolls on its own when taller. */}
        <aside
          aria-label="Verdict"
          tabIndex={-1}
          className="min-w-0 lg:sticky lg:top-20 lg:col-start-2 lg:row-span-5 lg:row-start-1 lg:max-h-[calc(100dvh-6rem)] lg:self-start lg:overflow-y-auto lg:overscroll-contain"
        >
          {/* Each <Suspense> here is hydrated in a task of its own (nothing in them suspends): the
              page's hydration comes in several short tasks instead of one long one, so the
              browser can answer input in between (docs/architecture.md, "The workbench's weight"). */}
          <Suspense>
            <VerdictPanel reviewId={reviewId} mechanisms={mechanisms} />
          </Suspense>
        </aside>

        <section aria-labelledby="mechanisms-title" className="min-w-0 space-y-4 lg:col-start-1">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="mechanisms-title" className="text-xl font-semibold">
              Mechanisms and their evidence
            </h2>
            <p className="text-ink-muted text-sm">
              {mechanisms.length} mechanism{mechanisms.length === 1 ? '' : 's'} · {appraisals.length} appraisal
              {appraisals.length === 1 ? '' : 's'}
            </p>
          </div>
          {mechanisms.length === 0 && (
            <p className="border-line-strong bg-paper-sunken/60 text-ink-muted rounded-lg border border-dashed px-5 py-6 text-sm">
              No candidate mechanisms yet.{' '}
              {canEdit
                ? 'Use “Add mechanism” in the editor’s toolbar: each one becomes a block in the text and gets its own evidence here.'
                : 'The author has not listed any.'}
            </p>
          )}
          <Suspense>
            {mechanisms.map((m) => (
              <MechanismCard
                key={m.id}
                mechanism={m}
                score={scores.get(m.id)}
                appraisals={byTarget.get(m.id) ?? []}
                studies={studyMap}
                canEdit={canEdit}
                inText={placed.has(m.id)}
                poolable={poolable(m.id)}
                reviewId={reviewId}
                onEdit={() => setMechanismDialog({ mode: 'edit', id: m.id })}
                onAppraise={() => setAppraisalDialog({ mode: 'create', mechanismId: m.id })}
                onEditAppraisal={(a) => setAppraisalDialog({ mode: 'edit', appraisal: a })}
                // Offered from the first paint (it waits for the editor), so the card keeps its size.
                onPlace={canEdit ? () => insertBlock(m.id) : undefined}
              />
            ))}
          </Suspense>
        </section>

        <Suspense>
          <OutcomeSection
            reviewId={reviewId}
            appraisals={byTarget.get(null) ?? []}
            studies={studyMap}
            canEdit={canEdit}
            poolable={poolable(null)}
            onAppraise={() => setAppraisalDialog({ mode: 'create', mechanismId: null })}
            onEditAppraisal={(a) => setAppraisalDialog({ mode: 'edit', appraisal: a })}
          />
        </Suspense>

        {/* Below the mechanisms on every screen size: each panel is fetched and drawn when the
            reader comes near it (./workbench/lazy.tsx), not while the page loads. */}
        <div className="min-w-0 lg:col-start-1">
          <DoseCheckPanel protocol={review.protocol} mechanisms={mechanisms} verdict={verdict.data} />
        </div>

        <div className="min-w-0 lg:col-start-1">
          <RecommendationsPanel
            review={review}
            canEdit={canEdit}
            onSave={async (recommendations) => {
              await saver.patch({ recommendations });
              await mutations.refresh();
            }}
          />
        </div>

        <div className="min-w-0 lg:col-start-1">
          <PublishPanel reviewId={reviewId} />
        </div>

        {canEdit && (
          <div className="min-w-0 lg:col-start-1">
            <SimilarReviews teamId={review.teamId} claim={review.claim} targetReviewId={reviewId} />
          </div>
        )}
      </div>

      <MechanismDialog
        mechanismDialog={mechanismDialog}
        editedMechanism={editedMechanism}
        review={review}
        canEdit={canEdit}
        score={editedMechanism ? scores.get(editedMechanism.id) : undefined}
        onClose={() => setMechanismDialog(null)}
        onUpdate={async (mechanism, input) => {
          await mutations.updateMechanism(mechanism.id, input);
          setMechanismDialog(null);
        }}
        onCreate={async (input) => {
          const created = await mutations.createMechanism(input);
          setMechanismDialog(null);
          insertBlock(created.id);
        }}
        onDelete={async (mechanism) => {
          await mutations.deleteMechanism(mechanism.id);
          setMechanismDialog(null);
          editor?.commands.removeMechanismBlocks(mechanism.id);
          setNotice(`Deleted the mechanism “${mechanism.name}”.`);
        }}
      />

      <AppraisalDialog
        appraisalDialog={appraisalDialog}
        review={review}
        mechanisms={mechanisms}
        studyList={studyList}
        libraryLoading={library.isLoading}
        appraisals={appraisals}
        onClose={() => setAppraisalDialog(null)}
        onSave={async (input, appraisal) => {
          if (appraisal) await mutations.updateAppraisal(appraisal.id, input);
          else await mutations.createAppraisal(input);
          setAppraisalDialog(null);
        }}
        onDelete={async (appraisal) => {
          await mutations.deleteAppraisal(appraisal.id);
          setAppraisalDialog(null);
        }}
      />

      <ClaimDialog
        open={editingClaim}
        review={review}
        onClose={() => setEditingClaim(false)}
        onSubmitEdit={async (fields) => {
          const saved = await saver.patch(fields);
          await mutations.refresh();
          void mutate(isReviewListKey);
          return saved;
        }}
      />

      <DeleteReviewDialog
        open={confirmingDelete}
        review={review}
        mechanismCount={mechanisms.length}
        appraisalCount={appraisals.length}
        onClose={() => setConfirmingDelete(false)}
      />
    </WorkbenchContext.Provider>
  );
}

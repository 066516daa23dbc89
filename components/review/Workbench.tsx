'use client';

import type { Editor } from '@tiptap/react';
import { notFound, useRouter } from 'next/navigation';
import { useCallback, useEffect, useMemo, useState } from 'react';
import { useSWRConfig } from 'swr';
import { AppraisalForm } from '@/components/appraisal/AppraisalForm';
import { AppraisalTable } from '@/components/appraisal/AppraisalTable';
import { MetaAnalysisPanel } from '@/components/charts/MetaAnalysisPanel';
import { mechanismIdsInBody } from '@/components/editor/body';
import { ReviewEditor } from '@/components/editor/ReviewEditor';
import { ReviewSaver } from '@/components/editor/review-saver';
import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import { Skeleton } from '@/components/ui/Skeleton';
import { VerdictPanel } from '@/components/verdict/VerdictPanel';
import { decide, type Actor } from '@/lib/auth/policy';
import type { AppraisalDTO, MechanismDTO, StudyDTO, VerdictMechanismDTO, WorkbenchDTO } from '@/lib/reviews/types';
import { apiFetch, errorMessage } from '@/lib/swr/fetcher';
import { isReviewListKey } from '@/lib/swr/keys';
import { useLibrary } from '@/lib/swr/use-library';
import { useReviewMutations } from '@/lib/swr/use-review-mutations';
import { useVerdict } from '@/lib/swr/use-verdict';
import { useWorkbench } from '@/lib/swr/use-workbench';
import { PublishPanel } from '@/components/publishing/PublishPanel';
import { priorShift } from './prior-shift';
import { RoundStatusBadge } from '@/components/rounds/RoundStatusBadge';
import { useReviewFrozen } from '@/components/rounds/use-rounds';
import { SimilarReviews } from '@/components/search/SimilarReviews';
import { ClaimForm } from './ClaimForm';
import { Dialog } from '@/components/ui/Dialog';
import { DoseCheckPanel } from './DoseCheckPanel';
import { MECHANISM_KIND_LABEL, percent } from './labels';
import { MechanismForm } from './MechanismForm';
import { RecommendationsPanel } from './RecommendationsPanel';
import { ReviewHeader } from './ReviewHeader';
import type { ViewerProps } from './viewer';
import { WorkbenchContext, type WorkbenchContextValue } from './workbench-context';

type Viewer = ViewerProps;

type MechanismDialog = { mode: 'create' } | { mode: 'edit'; id: number } | null;
type AppraisalDialog =
  { mode: 'create'; mechanismId: number | null } | { mode: 'edit'; appraisal: AppraisalDTO } | null;

/**
 * Ids of the mechanisms with a block in the text: the live editor's document once it exists,
 * else the stored body. `_version` only tells memoisation that the document changed.
 */
function placedMechanisms(editor: Editor | null, body: Record<string, unknown>, _version: number): Set<number> {
  if (!editor) return new Set(mechanismIdsInBody(body));
  const ids = new Set<number>();
  editor.state.doc.descendants((node) => {
    if (node.type.name === 'mechanismBlock' && typeof node.attrs.mechanismId === 'number')
      ids.add(node.attrs.mechanismId);
  });
  return ids;
}

/** The review workbench: loads the review, then hands it to the editor and panels. */
export function Workbench({
  reviewId,
  viewer,
  fallback,
}: {
  reviewId: number;
  viewer: Viewer;
  fallback?: WorkbenchDTO;
}) {
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

export function WorkbenchSkeleton() {
  return (
    <div role="status" aria-live="polite" className="space-y-6">
      <span className="sr-only">Loading the review…</span>
      <Skeleton className="h-5 w-40" />
      <Skeleton className="h-10 w-3/4" />
      <Skeleton className="h-16 w-full" />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <Skeleton className="h-96" />
        <Skeleton className="h-96" />
      </div>
    </div>
  );
}

function LoadedWorkbench({ data, viewer }: { data: WorkbenchDTO; viewer: Viewer }) {
  const router = useRouter();
  const { mutate } = useSWRConfig();
  const { review, mechanisms: unsorted, appraisals } = data;
  const reviewId = review.id;
  const mutations = useReviewMutations(reviewId);
  const verdict = useVerdict(reviewId);
  const library = useLibrary(review.teamId);
  // While a peer-review round is open the review is frozen (the server answers 409 as well).
  const frozen = useReviewFrozen(reviewId);
  // One saver for every PATCH of this review (body autosave and claim edits share the version).
  const [saver] = useState(() => new ReviewSaver(reviewId, review.version));
  const [editor, setEditor] = useState<Editor | null>(null);
  const [mechanismDialog, setMechanismDialog] = useState<MechanismDialog>(null);
  const [appraisalDialog, setAppraisalDialog] = useState<AppraisalDialog>(null);
  const [editingClaim, setEditingClaim] = useState(false);
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  const [deleteError, setDeleteError] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);

  const actor: Actor = useMemo(() => ({ userId: viewer.userId, roles: new Map(viewer.roles) }), [viewer]);
  // The same policy module the route handlers use; the server still checks every write.
  const canEdit =
    !frozen && decide(actor, 'review.update', { teamId: review.teamId, authorId: review.authorId }) === 'allow';
  const canDelete = decide(actor, 'review.delete', { teamId: review.teamId, authorId: review.authorId }) === 'allow';

  const mechanisms = useMemo(() => [...unsorted].sort((a, b) => a.position - b.position || a.id - b.id), [unsorted]);
  const mechanismMap = useMemo(() => new Map(mechanisms.map((m) => [m.id, m])), [mechanisms]);
  const studyMap = useMemo(() => {
    const map = new Map<number, StudyDTO>();
    for (const s of library.data ?? []) map.set(s.id, s);
    for (const s of data.citedStudies ?? []) map.set(s.id, s);
    for (const s of data.studies) map.set(s.id, s);
    return map;
  }, [library.data, data.studies, data.citedStudies]);
  const studyList = useMemo(() => [...studyMap.values()], [studyMap]);
  const scores = useMemo(() => {
    const map = new Map<number, VerdictMechanismDTO>();
    for (const m of verdict.data?.mechanisms ?? []) map.set(Number(m.id), m);
    return map;
  }, [verdict.data]);

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

  // Blocks present in the editor right now (the stored body lags behind until the autosave):
  // re-read on every change of the document.
  const [docVersion, setDocVersion] = useState(0);
  useEffect(() => {
    if (!editor) return;
    const bump = () => setDocVersion((v) => v + 1);
    editor.on('update', bump);
    return () => {
      editor.off('update', bump);
    };
  }, [editor]);
  const placed = useMemo(() => placedMechanisms(editor, review.body, docVersion), [editor, review.body, docVersion]);

  const byTarget = useMemo(() => {
    const map = new Map<number | null, AppraisalDTO[]>();
    for (const a of appraisals) {
      const list = map.get(a.mechanismId) ?? [];
      list.push(a);
      map.set(a.mechanismId, list);
    }
    return map;
  }, [appraisals]);
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

  const deleteReview = async () => {
    setDeleteError(null);
    try {
      await apiFetch(`/api/reviews/${reviewId}`, { method: 'DELETE' });
      void mutate(isReviewListKey);
      router.push('/reviews');
    } catch (error) {
      setDeleteError(errorMessage(error));
    }
  };

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
          <ReviewEditor
            review={review}
            saver={saver}
            editable={canEdit}
            library={studyList}
            libraryLoading={library.isLoading}
            libraryError={library.error ? `The library could not be loaded: ${library.error.message}` : undefined}
            onAddMechanism={() => setMechanismDialog({ mode: 'create' })}
            onEditor={setEditor}
          />
        </div>

        {/* On a phone the verdict follows the text; on a desktop it stays in view below the
            sticky app header while the page scrolls, and scrolls on its own when taller. */}
        <aside
          aria-label="Verdict"
          tabIndex={-1}
          className="min-w-0 lg:sticky lg:top-20 lg:col-start-2 lg:row-span-5 lg:row-start-1 lg:max-h-[calc(100dvh-6rem)] lg:self-start lg:overflow-y-auto lg:overscroll-contain"
        >
          <VerdictPanel reviewId={reviewId} mechanisms={mechanisms} />
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
              onPlace={editor && canEdit ? () => insertBlock(m.id) : undefined}
            />
          ))}
        </section>

        <section
          aria-labelledby="outcome-title"
          className="border-line bg-paper-raised shadow-card min-w-0 space-y-4 rounded-lg border px-5 py-4 lg:col-start-1"
        >
          <div className="flex flex-wrap items-start justify-between gap-3">
            <div className="space-y-1">
              <h2 id="outcome-title" className="text-lg font-semibold">
                The claimed outcome itself
              </h2>
              <p className="text-ink-muted text-sm">
                Studies that test the promised result directly, whatever the reason for it.
              </p>
            </div>
            {canEdit && (
              <Button
                variant="secondary"
                size="sm"
                onClick={() => setAppraisalDialog({ mode: 'create', mechanismId: null })}
              >
                Appraise a study for the outcome
              </Button>
            )}
          </div>
          <AppraisalTable
            appraisals={byTarget.get(null) ?? []}
            studies={studyMap}
            caption="Appraisals of the claimed outcome"
            canEdit={canEdit}
            onEdit={(a) => setAppraisalDialog({ mode: 'edit', appraisal: a })}
          />
          {poolable(null) && (
            <div className="border-line border-t pt-4">
              <h3 className="mb-3 text-base font-semibold">Meta-analysis</h3>
              <MetaAnalysisPanel reviewId={reviewId} target="outcome" subject="the claimed outcome" />
            </div>
          )}
        </section>

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

      <Dialog
        open={mechanismDialog !== null}
        onClose={() => setMechanismDialog(null)}
        title={mechanismDialog?.mode === 'edit' ? `Mechanism: ${editedMechanism?.name ?? ''}` : 'Add a mechanism'}
        description={
          mechanismDialog?.mode === 'create'
            ? 'It is placed in the text where the cursor was, and gets its own appraisals.'
            : canEdit
              ? undefined
              : 'Only its author or the team owner can change it.'
        }
      >
        {mechanismDialog?.mode === 'edit' && !editedMechanism ? (
          <p className="text-ink-muted text-sm">This mechanism no longer exists.</p>
        ) : canEdit || mechanismDialog?.mode === 'create' ? (
          <MechanismForm
            mechanism={editedMechanism}
            protocol={review.protocol}
            onCancel={() => setMechanismDialog(null)}
            onSubmit={async (input) => {
              if (mechanismDialog?.mode === 'edit' && editedMechanism) {
                await mutations.updateMechanism(editedMechanism.id, input);
                setMechanismDialog(null);
              } else {
                const created = await mutations.createMechanism(input);
                setMechanismDialog(null);
                insertBlock(created.id);
              }
            }}
            onDelete={
              editedMechanism
                ? async () => {
                    await mutations.deleteMechanism(editedMechanism.id);
                    setMechanismDialog(null);
                    editor?.commands.removeMechanismBlocks(editedMechanism.id);
                    setNotice(`Deleted the mechanism “${editedMechanism.name}”.`);
                  }
                : undefined
            }
          />
        ) : editedMechanism ? (
          <MechanismSummary mechanism={editedMechanism} score={scores.get(editedMechanism.id)} />
        ) : null}
      </Dialog>

      <Dialog
        wide
        open={appraisalDialog !== null}
        onClose={() => setAppraisalDialog(null)}
        title={appraisalDialog?.mode === 'edit' ? 'Edit the appraisal' : 'Appraise a study'}
        description="Certainty and applicability update as you change the form."
      >
        {appraisalDialog && (
          <AppraisalForm
            review={review}
            mechanisms={mechanisms}
            library={studyList}
            libraryLoading={library.isLoading}
            appraisals={appraisals}
            appraisal={appraisalDialog.mode === 'edit' ? appraisalDialog.appraisal : undefined}
            defaultMechanismId={
              appraisalDialog.mode === 'create' ? appraisalDialog.mechanismId : appraisalDialog.appraisal.mechanismId
            }
            onCancel={() => setAppraisalDialog(null)}
            onSubmit={async (input) => {
              if (appraisalDialog.mode === 'edit') await mutations.updateAppraisal(appraisalDialog.appraisal.id, input);
              else await mutations.createAppraisal(input);
              setAppraisalDialog(null);
            }}
            onDelete={
              appraisalDialog.mode === 'edit'
                ? async () => {
                    await mutations.deleteAppraisal(appraisalDialog.appraisal.id);
                    setAppraisalDialog(null);
                  }
                : undefined
            }
          />
        )}
      </Dialog>

      <Dialog
        wide
        open={editingClaim}
        onClose={() => setEditingClaim(false)}
        title="Edit the claim and protocol"
        description="Changing the protocol changes the dose check, the suggested applicability and the verdict."
      >
        <ClaimForm
          review={review}
          onCancel={() => setEditingClaim(false)}
          onSubmitEdit={async (fields) => {
            const saved = await saver.patch(fields);
            await mutations.refresh();
            void mutate(isReviewListKey);
            return saved;
          }}
          onSaved={() => setEditingClaim(false)}
        />
      </Dialog>

      <Dialog open={confirmingDelete} onClose={() => setConfirmingDelete(false)} title="Delete this review?">
        <div className="space-y-4">
          <p>
            “{review.title}” will be deleted with its {mechanisms.length} mechanism{mechanisms.length === 1 ? '' : 's'}{' '}
            and {appraisals.length} appraisal{appraisals.length === 1 ? '' : 's'}. The studies stay in the library.
          </p>
          {deleteError && (
            <p role="alert" className="bg-danger-50 text-danger-800 rounded-md px-3 py-2 text-sm">
              {deleteError}
            </p>
          )}
          <div className="flex flex-wrap gap-2">
            <Button variant="danger" onClick={() => void deleteReview()}>
              Yes, delete the review
            </Button>
            <Button variant="secondary" onClick={() => setConfirmingDelete(false)}>
              Keep it
            </Button>
          </div>
        </div>
      </Dialog>
    </WorkbenchContext.Provider>
  );
}

function MechanismSummary({ mechanism, score }: { mechanism: MechanismDTO; score?: VerdictMechanismDTO }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-sm">
      <dt className="font-semibold">Kind</dt>
      <dd>{MECHANISM_KIND_LABEL[mechanism.kind]}</dd>
      <dt className="font-semibold">Summary</dt>
      <dd>{mechanism.summary || '—'}</dd>
      <dt className="font-semibold">Probability</dt>
      <dd>{score ? `${percent(score.probability)} · ${score.term}` : '—'}</dd>
    </dl>
  );
}

function MechanismCard({
  mechanism,
  score,
  appraisals,
  studies,
  canEdit,
  inText,
  poolable,
  reviewId,
  onEdit,
  onAppraise,
  onEditAppraisal,
  onPlace,
}: {
  mechanism: MechanismDTO;
  score?: VerdictMechanismDTO;
  appraisals: AppraisalDTO[];
  studies: ReadonlyMap<number, StudyDTO>;
  canEdit: boolean;
  inText: boolean;
  poolable: boolean;
  reviewId: number;
  onEdit: () => void;
  onAppraise: () => void;
  onEditAppraisal: (a: AppraisalDTO) => void;
  onPlace?: () => void;
}) {
  const headingId = `mechanism-${mechanism.id}-title`;
  return (
    <article
      aria-labelledby={headingId}
      data-testid="mechanism-card"
      className="border-line bg-paper-raised shadow-card space-y-4 rounded-lg border px-5 py-4"
    >
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0 space-y-1">
          <p className="text-granite-700 flex flex-wrap items-center gap-2 text-xs font-semibold tracking-wide uppercase">
            {MECHANISM_KIND_LABEL[mechanism.kind]}
            {mechanism.stated && <Badge tone="accent">Named by the claim</Badge>}
            {!inText && <Badge>Not in the text</Badge>}
          </p>
          <h3 id={headingId} className="text-lg font-semibold">
            {mechanism.name}
          </h3>
          <p className="text-ink-muted text-sm">
            {score ? (
              <>
                <strong className="text-ink tabular-nums">{percent(score.probability)}</strong> · {score.term}
                <span className="block text-xs" data-testid="prior-shift">
                  {priorShift({
                    prior: mechanism.prior,
                    logOdds: score.logOdds,
                    dosePenalty: score.dosePenalty,
                    appraised: appraisals.length,
                  })}
                </span>
              </>
            ) : (
              'Not scored yet'
            )}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          {canEdit && (
            <Button variant="secondary" size="sm" onClick={onAppraise}>
              Appraise a study
            </Button>
          )}
          <Button
            variant="ghost"
            size="sm"
            onClick={onEdit}
            aria-label={`${canEdit ? 'Edit' : 'View'} mechanism ${mechanism.name}`}
          >
            {canEdit ? 'Edit' : 'Details'}
          </Button>
          {!inText && onPlace && (
            <Button variant="ghost" size="sm" onClick={onPlace}>
              Place in text
            </Button>
          )}
        </div>
      </div>
      {mechanism.summary && <p className="text-sm">{mechanism.summary}</p>}
      <AppraisalTable
        appraisals={appraisals}
        studies={studies}
        caption={`Appraisals for ${mechanism.name}`}
        canEdit={canEdit}
        onEdit={onEditAppraisal}
      />
      {poolable && (
        <div className="border-line border-t pt-4">
          <h4 className="mb-3 text-base font-semibold">Meta-analysis</h4>
          <MetaAnalysisPanel reviewId={reviewId} target={mechanism.id} subject={mechanism.name} />
        </div>
      )}
    </article>
  );
}

'use client';

import { NodeViewWrapper, type ReactNodeViewProps } from '@tiptap/react';
import type { ElementType, ReactNode } from 'react';
import { cn } from '@/components/ui/cn';
import { MECHANISM_KIND_LABEL, percent } from '@/components/review/labels';
import { useOptionalWorkbenchContext } from '@/components/review/workbench-context';
import type { MechanismDTO, VerdictMechanismDTO } from '@/lib/reviews/types';

/**
 * How a mechanism block looks in the review body: its kind, name, whether the claim names it,
 * and its probability with the likelihood words — all read live from the workbench, so an
 * appraisal saved below the editor changes the number here at once. Clicking the block (or
 * Enter while it is selected) opens the mechanism form.
 */
export function MechanismBlockView({ node, selected, deleteNode, editor }: ReactNodeViewProps) {
  const workbench = useOptionalWorkbenchContext();
  const id = node.attrs.mechanismId as number | null;
  return (
    <MechanismBlockFace
      as={NodeViewWrapper}
      id={id}
      mechanism={id == null ? undefined : workbench?.mechanisms.get(id)}
      score={id == null ? undefined : workbench?.scores.get(id)}
      verdictLoading={workbench?.verdictLoading ?? false}
      selected={selected}
      editable={editor.isEditable}
      onOpen={(mechanismId) => workbench?.openMechanism(mechanismId)}
      onRemove={() => deleteNode()}
    />
  );
}

/**
 * The block itself, for the node view and for the text shown before the editor exists
 * (BodyPreview), so both have the same size and nothing moves when the editor takes over.
 * Without `onRemove` (no editor yet) the remove button is shown but disabled.
 */
export function MechanismBlockFace({
  as: Wrapper = 'div',
  id,
  mechanism,
  score,
  verdictLoading,
  selected = false,
  editable,
  onOpen,
  onRemove,
}: {
  as?: ElementType;
  id: number | null;
  mechanism: MechanismDTO | undefined;
  score: VerdictMechanismDTO | undefined;
  verdictLoading: boolean;
  selected?: boolean;
  editable: boolean;
  onOpen: (mechanismId: number) => void;
  onRemove?: () => void;
}): ReactNode {
  // NodeViewWrapper takes the element to draw as a prop; a plain element needs none.
  const asDiv = Wrapper === 'div' ? {} : { as: 'div' };
  if (!mechanism) {
    return (
      <Wrapper
        {...asDiv}
        contentEditable={false}
        data-testid="mechanism-block"
        data-mechanism-id={id ?? ''}
        className={cn(
          'border-line-strong bg-paper-sunken text-ink-muted my-3 flex flex-wrap items-center justify-between gap-2 rounded-md border border-dashed px-4 py-3 text-sm whitespace-normal',
          selected && 'ring-rope-500 ring-2',
        )}
      >
        <span>This mechanism was deleted or belongs to another review.</span>
        {editable && (
          <button
            type="button"
            onClick={onRemove}
            disabled={!onRemove}
            className="border-line-strong bg-paper-raised text-ink hover:bg-chalk-100 rounded-md border px-3 py-1.5 font-semibold"
          >
            Remove block
          </button>
        )}
      </Wrapper>
    );
  }

  const scoreText = score
    ? `${percent(score.probability)} · ${score.term}`
    : verdictLoading
      ? 'Scoring…'
      : 'Not scored yet';

  return (
    <Wrapper
      {...asDiv}
      contentEditable={false}
      data-testid="mechanism-block"
      data-mechanism-id={id}
      className={cn(
        'group border-granite-200 bg-granite-50/70 shadow-card my-3 flex items-stretch overflow-hidden rounded-md border whitespace-normal',
        selected && 'ring-rope-500 ring-2 ring-offset-1',
      )}
    >
      {/* A grip to drag the block to another place in the text. */}
      <span
        data-drag-handle=""
        aria-hidden="true"
        title="Drag to move"
        className="border-granite-200 bg-granite-100/70 text-granite-500 flex w-6 shrink-0 cursor-grab items-center justify-center border-r"
      >
        <svg viewBox="0 0 8 16" className="h-4 w-2" fill="currentColor">
          <circle cx="2" cy="3" r="1.2" />
          <circle cx="6" cy="3" r="1.2" />
          <circle cx="2" cy="8" r="1.2" />
          <circle cx="6" cy="8" r="1.2" />
          <circle cx="2" cy="13" r="1.2" />
          <circle cx="6" cy="13" r="1.2" />
        </svg>
      </span>
      {/* Children ignore the pointer so the click's target is the button itself: the editor
          leaves events on buttons alone and would otherwise turn the click into a selection. */}
      <button
        type="button"
        onClick={() => onOpen(mechanism.id)}
        className="hover:bg-granite-100/60 flex min-w-0 flex-1 flex-wrap items-center justify-between gap-x-4 gap-y-1 px-4 py-3 text-left [&_*]:pointer-events-none"
      >
        <span className="min-w-0">
          <span className="text-granite-700 block text-xs font-semibold tracking-wide uppercase">
            Mechanism · {MECHANISM_KIND_LABEL[mechanism.kind]}
            {mechanism.stated && <span className="text-rope-700 ml-2">Named by the claim</span>}
          </span>
          <span className="font-display text-ink block text-base font-semibold">{mechanism.name}</span>
        </span>
        <span className="flex items-center gap-3">
          <span className="text-right">
            <span
              className="text-ink block text-base font-semibold tabular-nums"
              data-testid="mechanism-block-probability"
            >
              {score ? percent(score.probability) : '—'}
            </span>
            <span className="text-ink-muted block text-xs">{score ? score.term : scoreText}</span>
          </span>
          <span className="text-brand text-sm font-semibold underline-offset-2 group-hover:underline">
            Open<span className="sr-only"> the mechanism form</span>
          </span>
        </span>
      </button>
    </Wrapper>
  );
}

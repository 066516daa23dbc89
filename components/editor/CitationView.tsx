'use client';

import { NodeViewWrapper, type ReactNodeViewProps } from '@tiptap/react';
import type { ElementType } from 'react';
import { cn } from '@/components/ui/cn';
import { useOptionalWorkbenchContext } from '@/components/review/workbench-context';
import type { StudyDTO } from '@/lib/reviews/types';
import { noticeLine } from '@/lib/watch/notices';

/** An inline author–year citation, looked up in the library each time it renders. */
export function CitationView({ node, selected }: ReactNodeViewProps) {
  const workbench = useOptionalWorkbenchContext();
  const id = node.attrs.studyId as number | null;
  return (
    <CitationFace
      as={NodeViewWrapper}
      id={id}
      study={id == null ? undefined : workbench?.studies.get(id)}
      selected={selected}
    />
  );
}

/**
 * The citation itself, for the node view and for the text shown before the editor exists
 * (BodyPreview), so both take the same room.
 */
export function CitationFace({
  as: Wrapper = 'span',
  id,
  study,
  selected = false,
}: {
  as?: ElementType;
  id: number | null;
  study: StudyDTO | undefined;
  selected?: boolean;
}) {
  const text = study ? study.citation : id == null ? 'no study' : 'study not in library';
  return (
    <Wrapper
      // NodeViewWrapper takes the element to draw as a prop; a plain element needs none.
      {...(Wrapper === 'span' ? {} : { as: 'span' })}
      contentEditable={false}
      data-testid="citation"
      data-study-id={id ?? ''}
      data-notice={study?.notice?.kind}
      title={
        study
          ? `${study.title}${study.journal ? ` — ${study.journal}` : ''}${study.notice ? ` — ${noticeLine(study.notice)}` : ''}`
          : undefined
      }
      className={cn(
        'bg-rope-50 text-accent-text decoration-rope-300 mx-px rounded-sm px-0.5 whitespace-normal decoration-dotted',
        !study && 'text-ink-muted italic',
        // A study under a notice is struck through where it is cited, so the author sees it in the text.
        study?.notice && 'text-danger-800 line-through decoration-solid',
        selected && 'ring-rope-500 ring-2',
      )}
    >
      ({text}
      {study?.notice && <span className="sr-only"> — {noticeLine(study.notice)}</span>})
    </Wrapper>
  );
}

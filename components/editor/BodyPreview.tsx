'use client';

import type { JSONContent } from '@tiptap/core';
import { Fragment, type ReactNode } from 'react';
import { useWorkbenchContext } from '@/components/review/workbench-context';
import { CitationFace } from './CitationView';
import { MechanismBlockFace } from './MechanismBlockView';
import { PROSE } from './prose';

/**
 * The review text as the editor will show it, before the editor exists: the same elements
 * ProseMirror writes for each node (an empty paragraph keeps its line), and the same faces the
 * node views draw for mechanism blocks and citations. The server renders it, so the first paint
 * already has the text at its final size, and creating the editor after hydration moves nothing
 * (docs/architecture.md, "The workbench's weight").
 */
export function BodyPreview({ body }: { body: JSONContent }) {
  const workbench = useWorkbenchContext();

  const render = (node: JSONContent, key: number): ReactNode => {
    const children = node.content?.map(render);
    switch (node.type) {
      case 'paragraph':
        // ProseMirror puts a break into an empty paragraph so that it keeps one line's height.
        return <p key={key}>{children?.length ? children : <br className="ProseMirror-trailingBreak" />}</p>;
      case 'heading':
        return node.attrs?.level === 3 ? <h3 key={key}>{children}</h3> : <h2 key={key}>{children}</h2>;
      case 'bulletList':
        return <ul key={key}>{children}</ul>;
      case 'orderedList': {
        const start = Number(node.attrs?.start ?? 1);
        return (
          <ol key={key} start={start === 1 ? undefined : start}>
            {children}
          </ol>
        );
      }
      case 'listItem':
        return <li key={key}>{children}</li>;
      case 'blockquote':
        return <blockquote key={key}>{children}</blockquote>;
      case 'horizontalRule':
        return <hr key={key} />;
      case 'hardBreak':
        return <br key={key} />;
      case 'mechanismBlock': {
        const id = typeof node.attrs?.mechanismId === 'number' ? node.attrs.mechanismId : null;
        return (
          <div key={key} className="react-renderer node-mechanismBlock">
            <MechanismBlockFace
              id={id}
              mechanism={id == null ? undefined : workbench.mechanisms.get(id)}
              score={id == null ? undefined : workbench.scores.get(id)}
              verdictLoading={workbench.verdictLoading}
              editable={workbench.canEdit}
              onOpen={workbench.openMechanism}
            />
          </div>
        );
      }
      case 'citation': {
        const id = typeof node.attrs?.studyId === 'number' ? node.attrs.studyId : null;
        return (
          <span key={key} className="react-renderer node-citation">
            <CitationFace id={id} study={id == null ? undefined : workbench.studies.get(id)} />
          </span>
        );
      }
      case 'text': {
        let out: ReactNode = node.text ?? '';
        for (const mark of node.marks ?? []) {
          if (mark.type === 'bold') out = <strong>{out}</strong>;
          else if (mark.type === 'italic') out = <em>{out}</em>;
          else if (mark.type === 'strike') out = <s>{out}</s>;
          else if (mark.type === 'underline') out = <u>{out}</u>;
          else if (mark.type === 'code') out = <code>{out}</code>;
        }
        return <Fragment key={key}>{out}</Fragment>;
      }
      default:
        return children ? <div key={key}>{children}</div> : null;
    }
  };

  return <>{body.content?.map(render)}</>;
}

/**
 * The preview inside the editor's own frame: the element ProseMirror's view would be, with the
 * editor's classes and what ProseMirror's style sheet gives it (white-space, no ligatures).
 * `busy` while an editor is on its way to replace it.
 */
export function BodyPreviewFrame({ body, busy }: { body: JSONContent; busy: boolean }) {
  return (
    <div className={PROSE}>
      <div
        aria-busy={busy || undefined}
        className="relative min-h-72 px-5 py-4 [font-feature-settings:'liga'_0] break-words whitespace-break-spaces [font-variant-ligatures:none]"
      >
        <BodyPreview body={body} />
      </div>
    </div>
  );
}

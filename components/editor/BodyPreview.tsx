'use client';

import type { JSONContent } from '@tiptap/core';
import { useWorkbenchContext } from '@/components/review/workbench-context';
import { CitationFace } from './CitationView';
import { MechanismBlockFace } from './MechanismBlockView';
import { PROSE } from './prose';
import { renderBody } from './render-body';

/**
 * The review text as the editor will show it, before the editor exists: the same elements
 * ProseMirror writes for each node (an empty paragraph keeps its line), and the same faces the
 * node views draw for mechanism blocks and citations. The server renders it, so the first paint
 * already has the text at its final size, and creating the editor after hydration moves nothing
 * (docs/architecture.md, "The workbench's weight").
 */
export function BodyPreview({ body }: { body: JSONContent }) {
  const workbench = useWorkbenchContext();
  return renderBody(body, {
    heading: (level, children, key) => (level === 3 ? <h3 key={key}>{children}</h3> : <h2 key={key}>{children}</h2>),
    mechanismBlock: (id, key) => (
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
    ),
    citation: (id, key) => (
      <span key={key} className="react-renderer node-citation">
        <CitationFace id={id} study={id == null ? undefined : workbench.studies.get(id)} />
      </span>
    ),
  });
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

import type { JSONContent } from '@tiptap/core';
import { PROSE } from '@/components/editor/prose';
import { renderBody } from '@/components/editor/render-body';

/**
 * The review body (Tiptap JSON) rendered read-only for reviewers, as plain React elements: no
 * editor, no HTML strings, and mechanism blocks show the mechanism's name only — never the
 * engine's score the workbench shows beside it.
 */
export function ReviewBody({
  body,
  mechanismName,
  citation,
}: {
  body: Record<string, unknown>;
  mechanismName: (id: number) => string | undefined;
  citation: (studyId: number) => string | undefined;
}) {
  const doc = body as JSONContent;
  if (!doc.content?.length) return <p className="text-ink-muted">The author has not written the analysis yet.</p>;
  return (
    <div className={PROSE}>
      {renderBody(doc, {
        // One level below the scorecard's own headings.
        heading: (level, children, key) =>
          level <= 2 ? (
            <h3 key={key}>{children}</h3>
          ) : (
            <h4 key={key} className="font-semibold">
              {children}
            </h4>
          ),
        citation: (id, key) => (
          <span key={key} className="text-accent-text font-medium">
            ({(id != null && citation(id)) || 'a study no longer in the library'})
          </span>
        ),
        mechanismBlock: (id, key) => {
          const name = id == null ? undefined : mechanismName(id);
          return (
            <div key={key} className="border-granite-200 bg-granite-50 my-3 rounded-md border px-3 py-2 font-semibold">
              {name ? <a href={`#mechanism-${id}`}>Mechanism: {name}</a> : 'A mechanism that was removed'}
            </div>
          );
        },
      })}
    </div>
  );
}

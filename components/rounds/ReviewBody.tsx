import type { ReactNode } from 'react';
import { PROSE } from '@/components/editor/prose';

type Node = {
  type?: string;
  text?: string;
  attrs?: Record<string, unknown>;
  marks?: { type: string; attrs?: Record<string, unknown> }[];
  content?: Node[];
};

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
  const doc = body as Node;
  if (!doc.content?.length) return <p className="text-ink-muted">The author has not written the analysis yet.</p>;
  const render = (node: Node, key: number): ReactNode => {
    const children = node.content?.map(render);
    switch (node.type) {
      case 'paragraph':
        return <p key={key}>{children}</p>;
      case 'heading': {
        const level = Number(node.attrs?.level ?? 2);
        return level <= 2 ? (
          <h3 key={key}>{children}</h3>
        ) : (
          <h4 key={key} className="font-semibold">
            {children}
          </h4>
        );
      }
      case 'bulletList':
        return <ul key={key}>{children}</ul>;
      case 'orderedList':
        return <ol key={key}>{children}</ol>;
      case 'listItem':
        return <li key={key}>{children}</li>;
      case 'blockquote':
        return <blockquote key={key}>{children}</blockquote>;
      case 'horizontalRule':
        return <hr key={key} />;
      case 'hardBreak':
        return <br key={key} />;
      case 'citation': {
        const id = Number(node.attrs?.studyId);
        return (
          <span key={key} className="text-accent-text font-medium">
            ({citation(id) ?? 'a study no longer in the library'})
          </span>
        );
      }
      case 'mechanismBlock': {
        const id = Number(node.attrs?.mechanismId);
        const name = mechanismName(id);
        return (
          <div key={key} className="border-granite-200 bg-granite-50 my-3 rounded-md border px-3 py-2 font-semibold">
            {name ? <a href={`#mechanism-${id}`}>Mechanism: {name}</a> : 'A mechanism that was removed'}
          </div>
        );
      }
      case 'text': {
        let out: ReactNode = node.text ?? '';
        for (const mark of node.marks ?? []) {
          if (mark.type === 'bold') out = <strong>{out}</strong>;
          else if (mark.type === 'italic') out = <em>{out}</em>;
          else if (mark.type === 'code') out = <code>{out}</code>;
          else if (mark.type === 'link' && typeof mark.attrs?.href === 'string' && /^https?:\/\//.test(mark.attrs.href))
            out = (
              <a href={mark.attrs.href} target="_blank" rel="noreferrer noopener">
                {out}
              </a>
            );
        }
        return <span key={key}>{out}</span>;
      }
      default:
        return children ? <div key={key}>{children}</div> : null;
    }
  };
  return <div className={PROSE}>{doc.content.map(render)}</div>;
}

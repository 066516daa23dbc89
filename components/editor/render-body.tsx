import type { JSONContent } from '@tiptap/core';
import { Fragment, type ReactNode } from 'react';

/**
 * What differs between the places that draw a stored review body without an editor: the
 * workbench's preview draws headings, mechanism blocks and citations as the editor's node views
 * do; the reviewer's read-only copy draws them one level down and without the engine's numbers.
 */
export interface BodyParts {
  heading(level: number, children: ReactNode, key: number): ReactNode;
  mechanismBlock(mechanismId: number | null, key: number): ReactNode;
  citation(studyId: number | null, key: number): ReactNode;
}

const idOf = (value: unknown) => (typeof value === 'number' && Number.isInteger(value) ? value : null);

/** Marks as the editor writes them; a link only when it is a plain web address. */
function withMarks(text: string, marks: JSONContent['marks']): ReactNode {
  let out: ReactNode = text;
  for (const mark of marks ?? []) {
    if (mark.type === 'bold') out = <strong>{out}</strong>;
    else if (mark.type === 'italic') out = <em>{out}</em>;
    else if (mark.type === 'strike') out = <s>{out}</s>;
    else if (mark.type === 'underline') out = <u>{out}</u>;
    else if (mark.type === 'code') out = <code>{out}</code>;
    else if (mark.type === 'link' && typeof mark.attrs?.href === 'string' && /^https?:\/\//.test(mark.attrs.href))
      out = (
        <a href={mark.attrs.href} target="_blank" rel="noreferrer noopener">
          {out}
        </a>
      );
  }
  return out;
}

/**
 * A review body (Tiptap JSON) as plain React elements — no editor, no HTML strings — with the
 * same elements ProseMirror writes for each node (an empty paragraph keeps its line).
 */
export function renderBody(body: JSONContent, parts: BodyParts): ReactNode {
  const render = (node: JSONContent, key: number): ReactNode => {
    const children = node.content?.map(render);
    switch (node.type) {
      case 'paragraph':
        // ProseMirror puts a break into an empty paragraph so that it keeps one line's height.
        return <p key={key}>{children?.length ? children : <br className="ProseMirror-trailingBreak" />}</p>;
      case 'heading':
        return parts.heading(Number(node.attrs?.level ?? 2), children, key);
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
      case 'mechanismBlock':
        return parts.mechanismBlock(idOf(node.attrs?.mechanismId), key);
      case 'citation':
        return parts.citation(idOf(node.attrs?.studyId), key);
      case 'text':
        return <Fragment key={key}>{withMarks(node.text ?? '', node.marks)}</Fragment>;
      default:
        return children ? <div key={key}>{children}</div> : null;
    }
  };
  return <>{body.content?.map(render)}</>;
}

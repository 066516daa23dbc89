import type { JSONContent } from '@tiptap/core';

/** An empty review body: one empty paragraph (a ProseMirror doc needs at least one block). */
export const EMPTY_BODY: JSONContent = { type: 'doc', content: [{ type: 'paragraph' }] };

/**
 * The stored body as editor content. A new review's body may be `{}` or a doc without blocks;
 * both become the empty body instead of an editor error.
 */
export function toEditorContent(body: Record<string, unknown> | null | undefined): JSONContent {
  if (!body || body.type !== 'doc' || !Array.isArray(body.content) || body.content.length === 0) return EMPTY_BODY;
  return body as JSONContent;
}

/** The ids of mechanisms that have a block in the body, in document order. */
export function mechanismIdsInBody(body: JSONContent | Record<string, unknown> | null | undefined): number[] {
  const ids: number[] = [];
  const walk = (node: unknown) => {
    if (!node || typeof node !== 'object') return;
    const n = node as JSONContent;
    if (n.type === 'mechanismBlock' && typeof n.attrs?.mechanismId === 'number') ids.push(n.attrs.mechanismId);
    n.content?.forEach(walk);
  };
  walk(body);
  return ids;
}

'use client';

import type { Editor } from '@tiptap/react';
import { useEffect, useMemo, useState } from 'react';
import { mechanismIdsInBody } from '@/components/editor/body';

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

/**
 * Blocks present in the editor right now (the stored body lags behind until the autosave):
 * re-read on every change of the document.
 */
export function usePlacedMechanisms(editor: Editor | null, body: Record<string, unknown>): Set<number> {
  const [docVersion, setDocVersion] = useState(0);
  useEffect(() => {
    if (!editor) return;
    const bump = () => setDocVersion((v) => v + 1);
    editor.on('update', bump);
    return () => {
      editor.off('update', bump);
    };
  }, [editor]);
  return useMemo(() => placedMechanisms(editor, body, docVersion), [editor, body, docVersion]);
}

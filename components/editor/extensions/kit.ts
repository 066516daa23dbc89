import { Blockquote } from '@tiptap/extension-blockquote';
import { Bold } from '@tiptap/extension-bold';
import { Code } from '@tiptap/extension-code';
import { Document } from '@tiptap/extension-document';
import { HardBreak } from '@tiptap/extension-hard-break';
import { Heading } from '@tiptap/extension-heading';
import { HorizontalRule } from '@tiptap/extension-horizontal-rule';
import { Italic } from '@tiptap/extension-italic';
import { BulletList, ListItem, ListKeymap, OrderedList } from '@tiptap/extension-list';
import { Paragraph } from '@tiptap/extension-paragraph';
import { Strike } from '@tiptap/extension-strike';
import { Text } from '@tiptap/extension-text';
import { Underline } from '@tiptap/extension-underline';
import { Dropcursor, Gapcursor, UndoRedo } from '@tiptap/extensions';

/**
 * The editor's basic extensions: the starter kit's, in its order, minus the three the review
 * text does not use — links (they need a URL dialog we do not have yet; pasted links stay plain
 * text), code blocks, and the trailing node (it appends an empty paragraph to a document that
 * ends in a block, which would count as an edit the moment a review opens and save a version
 * nobody wrote; the gap cursor lets the coach type after a final block instead). Listed one by
 * one because the kit imports every extension whether enabled or not, and the link extension's
 * URL detection alone is a good part of the workbench's JavaScript.
 * The schema is the same as the server's (lib/publishing/render-body.ts).
 */
export function basicExtensions() {
  return [
    Bold,
    Blockquote,
    BulletList,
    Code,
    Document,
    Dropcursor,
    Gapcursor,
    HardBreak,
    Heading.configure({ levels: [2, 3] }),
    UndoRedo,
    HorizontalRule,
    Italic,
    ListItem,
    ListKeymap,
    OrderedList,
    Paragraph,
    Strike,
    Text,
    Underline,
  ];
}

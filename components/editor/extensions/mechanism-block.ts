import { mergeAttributes, Node } from '@tiptap/core';
import { NodeSelection } from '@tiptap/pm/state';

/**
 * `mechanismBlock`: one candidate mechanism placed in the review body. The node stores only the
 * mechanism's id — name, probability and term live in the database and the verdict and change
 * without the body being saved again. It is an atom: the text around it is the coach's
 * analysis, the block itself is edited through the mechanism form.
 *
 * This file is the schema only (no React), so a server can render a stored body to HTML with
 * the same node definition; the workbench adds its React node view on top (ReviewEditor).
 */

export interface MechanismBlockOptions {
  /** Opens the mechanism form; called on Enter when the block is selected. */
  onOpen: (mechanismId: number) => void;
  /** The mechanism's current name, for HTML and plain-text copies of the body. */
  describe: (mechanismId: number) => string | undefined;
}

declare module '@tiptap/core' {
  interface Commands<ReturnType> {
    mechanismBlock: {
      /** Inserts a block for the mechanism at the selection. */
      insertMechanismBlock: (mechanismId: number) => ReturnType;
      /** Removes every block of the mechanism (after the mechanism itself was deleted). */
      removeMechanismBlocks: (mechanismId: number) => ReturnType;
    };
  }
}

const readId = (value: string | null): number | null => {
  const id = Number(value);
  return Number.isInteger(id) && id > 0 ? id : null;
};

export const MechanismBlock = Node.create<MechanismBlockOptions>({
  name: 'mechanismBlock',
  group: 'block',
  atom: true,
  selectable: true,
  draggable: true,

  addOptions() {
    return { onOpen: () => {}, describe: () => undefined };
  },

  addAttributes() {
    return {
      mechanismId: {
        default: null,
        parseHTML: (element) => readId(element.getAttribute('data-mechanism-id')),
        renderHTML: (attributes) =>
          attributes.mechanismId == null ? {} : { 'data-mechanism-id': String(attributes.mechanismId) },
      },
    };
  },

  parseHTML() {
    return [{ tag: 'div[data-type="mechanism-block"]' }];
  },

  renderHTML({ node, HTMLAttributes }) {
    const id = node.attrs.mechanismId as number | null;
    const name = id == null ? undefined : this.options.describe(id);
    return [
      'div',
      mergeAttributes({ 'data-type': 'mechanism-block' }, HTMLAttributes),
      `Mechanism: ${name ?? `#${id ?? '?'}`}`,
    ];
  },

  renderText({ node }) {
    const id = node.attrs.mechanismId as number | null;
    const name = id == null ? undefined : this.options.describe(id);
    return `[Mechanism: ${name ?? `#${id ?? '?'}`}]`;
  },

  addCommands() {
    return {
      insertMechanismBlock:
        (mechanismId) =>
        ({ state, chain }) => {
          // The block, then an empty paragraph for the cursor: the coach keeps writing below it
          // and a second block is not dropped onto the first (which would replace it).
          const content = [{ type: this.name, attrs: { mechanismId } }, { type: 'paragraph' }];
          const { selection } = state;
          // A selected block (or other node) stays: the new one goes after it.
          if (selection instanceof NodeSelection) return chain().insertContentAt(selection.to, content).run();
          return chain().insertContent(content).run();
        },
      removeMechanismBlocks:
        (mechanismId) =>
        ({ tr, state, dispatch }) => {
          const positions: number[] = [];
          state.doc.descendants((node, pos) => {
            if (node.type.name === this.name && node.attrs.mechanismId === mechanismId) positions.push(pos);
          });
          if (positions.length === 0) return false;
          if (dispatch) {
            // From the end, so earlier positions stay valid while we delete.
            for (const pos of positions.reverse()) {
              const node = tr.doc.nodeAt(pos);
              if (node) tr.delete(pos, pos + node.nodeSize);
            }
          }
          return true;
        },
    };
  },

  addKeyboardShortcuts() {
    // Enter on a selected block opens its form instead of replacing the block with a new line.
    const open = () => {
      const { selection } = this.editor.state;
      if (selection instanceof NodeSelection && selection.node.type.name === this.name) {
        const id = selection.node.attrs.mechanismId as number | null;
        if (id != null) this.options.onOpen(id);
        return true;
      }
      return false;
    };
    return { Enter: open, Space: open };
  },
});

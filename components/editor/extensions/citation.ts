import { mergeAttributes, Node } from '@tiptap/core';

/**
 * `citation`: an inline pointer from the review body to a study in the team's library. Only the
 * study id is stored; the author–year text ("Holt & Wren, 2024") is looked up when it is shown,
 * so correcting a reference in the library corrects every review that cites it.
 *
 * Schema only; the workbench adds the React node view (ReviewEditor).
 */

export interface CitationOptions {
  /** The study's author–year text without brackets, e.g. "Holt & Wren, 2024". */
  describe: (studyId: number) => string | undefined;
}

declare module '@tiptap/core' {
  interface Commands<ReturnType> {
    citation: {
      /** Inserts a citation of the study at the selection. */
      insertCitation: (studyId: number) => ReturnType;
    };
  }
}

const readId = (value: string | null): number | null => {
  const id = Number(value);
  return Number.isInteger(id) && id > 0 ? id : null;
};

export const Citation = Node.create<CitationOptions>({
  name: 'citation',
  group: 'inline',
  inline: true,
  atom: true,
  selectable: true,

  addOptions() {
    return { describe: () => undefined };
  },

  addAttributes() {
    return {
      studyId: {
        default: null,
        parseHTML: (element) => readId(element.getAttribute('data-study-id')),
        renderHTML: (attributes) => (attributes.studyId == null ? {} : { 'data-study-id': String(attributes.studyId) }),
      },
    };
  },

  parseHTML() {
    return [{ tag: 'span[data-type="citation"]' }];
  },

  renderHTML({ node, HTMLAttributes }) {
    const id = node.attrs.studyId as number | null;
    const text = id == null ? undefined : this.options.describe(id);
    return [
      'span',
      mergeAttributes({ 'data-type': 'citation' }, HTMLAttributes),
      `(${text ?? 'study not in library'})`,
    ];
  },

  renderText({ node }) {
    const id = node.attrs.studyId as number | null;
    const text = id == null ? undefined : this.options.describe(id);
    return `(${text ?? 'study not in library'})`;
  },

  addCommands() {
    return {
      insertCitation:
        (studyId) =>
        ({ chain }) =>
          // A space after the citation so the coach can keep typing straight away.
          chain()
            .insertContent([
              { type: this.name, attrs: { studyId } },
              { type: 'text', text: ' ' },
            ])
            .run(),
    };
  },
});

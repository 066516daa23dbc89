import { getSchema } from '@tiptap/core';
import StarterKit from '@tiptap/starter-kit';
import { describe, expect, it } from 'vitest';
import { basicExtensions } from '@/components/editor/extensions/kit';

// The editor lists the starter kit's extensions one by one (to leave the unused ones out of the
// bundle); a stored review must parse exactly as it did with the kit itself.
describe('the editor’s basic extensions', () => {
  const kit = getSchema([
    StarterKit.configure({ heading: { levels: [2, 3] }, link: false, codeBlock: false, trailingNode: false }),
  ]);
  const ours = getSchema(basicExtensions());

  it('make the same schema as the starter kit without links, code blocks and the trailing node', () => {
    expect(Object.keys(ours.nodes)).toEqual(Object.keys(kit.nodes));
    expect(Object.keys(ours.marks)).toEqual(Object.keys(kit.marks));
    for (const name of Object.keys(kit.nodes)) {
      expect([name, ours.nodes[name].spec.content, ours.nodes[name].spec.group]).toEqual([
        name,
        kit.nodes[name].spec.content,
        kit.nodes[name].spec.group,
      ]);
    }
    expect(ours.nodes.heading.spec.attrs).toEqual(kit.nodes.heading.spec.attrs);
  });

  it('parse a stored document the same way', () => {
    const doc = {
      type: 'doc',
      content: [
        { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Why it might work' }] },
        { type: 'paragraph', content: [{ type: 'text', marks: [{ type: 'bold' }], text: 'Load' }] },
        { type: 'bulletList', content: [{ type: 'listItem', content: [{ type: 'paragraph' }] }] },
      ],
    };
    expect(ours.nodeFromJSON(doc).toJSON()).toEqual(kit.nodeFromJSON(doc).toJSON());
  });
});

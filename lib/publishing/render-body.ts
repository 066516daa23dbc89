import { mergeAttributes, Node, type Extensions, type JSONContent } from '@tiptap/core';
import { generateHTML } from '@tiptap/html/server';
import StarterKit from '@tiptap/starter-kit';
import { sanitizeHtml } from './sanitize';

/**
 * The review body (Tiptap JSON) → the HTML a verdict page shows, on the server (@tiptap/html on
 * happy-dom), then through the allow-list of ./sanitize.ts. Our two custom nodes get their own
 * renderers here (lib/ never imports the editor's components): a mechanism block becomes a link
 * to that mechanism in the ranked list, a citation a link to its reference. Unknown node and mark
 * types are dropped first, since generateHTML refuses a document its schema does not know.
 */

export interface BodyContext {
  mechanismName: (id: number) => string | undefined;
  /** Author–year text, and whether the study is in the page's reference list. */
  citation: (studyId: number) => string | undefined;
}

function serverNodes(ctx: BodyContext): Extensions {
  const mechanismBlock = Node.create({
    name: 'mechanismBlock',
    group: 'block',
    atom: true,
    addAttributes: () => ({ mechanismId: { default: null } }),
    renderHTML({ node }) {
      const id = Number(node.attrs.mechanismId);
      const name = Number.isInteger(id) ? ctx.mechanismName(id) : undefined;
      if (!name) return ['p', { class: 'mechanism-ref' }, 'A mechanism that is no longer part of this review.'];
      return [
        'aside',
        { class: 'mechanism-ref', 'aria-label': `Mechanism: ${name}` },
        ['a', mergeAttributes({ href: `#mechanism-${id}` }), `Mechanism: ${name}`],
      ];
    },
  });
  const citation = Node.create({
    name: 'citation',
    group: 'inline',
    inline: true,
    atom: true,
    addAttributes: () => ({ studyId: { default: null } }),
    renderHTML({ node }) {
      const id = Number(node.attrs.studyId);
      const text = Number.isInteger(id) ? ctx.citation(id) : undefined;
      if (!text) return ['span', { class: 'citation' }, '(reference not available)'];
      return ['a', { class: 'citation', href: `#ref-${id}` }, `(${text})`];
    },
  });
  return [
    StarterKit.configure({ heading: { levels: [2, 3] }, codeBlock: false, trailingNode: false }),
    mechanismBlock,
    citation,
  ];
}

const NODES = new Set([
  'doc',
  'paragraph',
  'text',
  'heading',
  'bulletList',
  'orderedList',
  'listItem',
  'blockquote',
  'hardBreak',
  'horizontalRule',
  'mechanismBlock',
  'citation',
]);
const MARKS = new Set(['bold', 'italic', 'strike', 'underline', 'code', 'link']);

/** A copy of the document with only the node and mark types the renderer knows. */
export function knownNodesOnly(node: JSONContent, depth = 0): JSONContent | null {
  if (depth > 64 || !node || typeof node !== 'object' || !NODES.has(String(node.type))) return null;
  const out: JSONContent = { type: node.type };
  if (node.attrs) {
    out.attrs = { ...node.attrs };
    // Heading levels outside 2–3 would fall back to h1 and break the page's one-h1 outline.
    if (node.type === 'heading') out.attrs.level = node.attrs.level === 3 ? 3 : 2;
  }
  if (typeof node.text === 'string') out.text = node.text;
  if (Array.isArray(node.marks)) out.marks = node.marks.filter((m) => m && MARKS.has(String(m.type)));
  if (Array.isArray(node.content)) {
    out.content = node.content.map((c) => knownNodesOnly(c, depth + 1)).filter((c): c is JSONContent => c !== null);
  }
  return out;
}

export function renderBodyHtml(body: unknown, ctx: BodyContext): string {
  const doc = knownNodesOnly((body ?? { type: 'doc' }) as JSONContent) ?? { type: 'doc', content: [] };
  if (!doc.content?.length) return '';
  const html = generateHTML(doc, serverNodes(ctx));
  // The page's outline: h1 is the claim, h2 the page's sections; the body's headings sit under them.
  const demoted = html.replace(/<(\/?)h3(\s|>)/g, '<$1h4$2').replace(/<(\/?)h2(\s|>)/g, '<$1h3$2');
  return sanitizeHtml(demoted);
}

/** The body's words, for search (no HTML). */
export function bodyPlainText(body: unknown): string {
  const parts: string[] = [];
  const visit = (node: unknown, depth: number) => {
    if (depth > 64 || !node || typeof node !== 'object') return;
    const n = node as JSONContent;
    if (typeof n.text === 'string') parts.push(n.text);
    if (Array.isArray(n.content)) for (const c of n.content) visit(c, depth + 1);
  };
  visit(body, 0);
  return parts.join(' ').replace(/\s+/g, ' ').trim();
}

import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { ReviewBody } from '@/components/rounds/ReviewBody';

// The reviewer's read-only copy of the review text (components/editor/render-body.tsx draws it
// for both the reviewer and the workbench's preview).

const html = (body: Record<string, unknown>) =>
  renderToStaticMarkup(
    createElement(ReviewBody, {
      body,
      mechanismName: (id: number) => (id === 7 ? 'Tendon stiffness' : undefined),
      citation: (id: number) => (id === 3 ? 'Hollis & Brandt, 2019' : undefined),
    }),
  );

const doc = (...content: unknown[]) => ({ type: 'doc', content });
const text = (t: string, marks?: unknown[]) => ({ type: 'text', text: t, marks });

describe('the reviewer’s copy of the review text', () => {
  it('says so when the author has written nothing', () => {
    expect(html({})).toContain('has not written the analysis yet');
  });

  it('draws headings one level below the scorecard’s own', () => {
    const out = html(
      doc(
        { type: 'heading', attrs: { level: 2 }, content: [text('Why')] },
        { type: 'heading', attrs: { level: 3 }, content: [text('Dose')] },
      ),
    );
    expect(out).toContain('<h3>Why</h3>');
    expect(out).toContain('<h4 class="font-semibold">Dose</h4>');
  });

  it('names mechanisms and cites studies without any engine number', () => {
    const out = html(
      doc(
        { type: 'mechanismBlock', attrs: { mechanismId: 7 } },
        { type: 'mechanismBlock', attrs: { mechanismId: 8 } },
        { type: 'paragraph', content: [text('As shown '), { type: 'citation', attrs: { studyId: 3 } }] },
        { type: 'paragraph', content: [{ type: 'citation', attrs: { studyId: 4 } }] },
      ),
    );
    expect(out).toContain('<a href="#mechanism-7">Mechanism: Tendon stiffness</a>');
    expect(out).toContain('A mechanism that was removed');
    expect(out).toContain('(Hollis &amp; Brandt, 2019)');
    expect(out).toContain('(a study no longer in the library)');
    expect(out).not.toMatch(/\d+\s?%/);
  });

  it('keeps the marks, a list’s start and an empty line, and links only to web addresses', () => {
    const out = html(
      doc(
        { type: 'paragraph', content: [text('strong', [{ type: 'bold' }]), text('gone', [{ type: 'strike' }])] },
        { type: 'paragraph' },
        { type: 'orderedList', attrs: { start: 3 }, content: [{ type: 'listItem', content: [text('third')] }] },
        {
          type: 'paragraph',
          content: [
            text('safe', [{ type: 'link', attrs: { href: 'https://example.test/a' } }]),
            text('unsafe', [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }]),
          ],
        },
      ),
    );
    expect(out).toContain('<strong>strong</strong><s>gone</s>');
    expect(out).toContain('<p><br class="ProseMirror-trailingBreak"/></p>');
    expect(out).toContain('<ol start="3"><li>third</li></ol>');
    expect(out).toContain('<a href="https://example.test/a" target="_blank" rel="noreferrer noopener">safe</a>');
    expect(out).not.toContain('javascript:');
    expect(out).toContain('unsafe');
  });
});

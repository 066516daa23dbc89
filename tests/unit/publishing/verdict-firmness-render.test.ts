import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { VerdictArticle } from '@/components/verdict-page/VerdictArticle';
import type { VerdictPageDTO, VersionSnapshot } from '@/lib/publishing/types';

// The published page renders the snapshot as it was stored: a version published before verdicts
// said how firm they are has no `robustness` and must still render, without the section.

const snapshot: VersionSnapshot = {
  schema: 1,
  title: 'Light daily hangs',
  claim: 'Light daily hangs make fingers stronger in eight weeks.',
  claimSource: 'A forum post',
  claimUrl: null,
  tags: [],
  protocol: {} as VersionSnapshot['protocol'],
  everyday: { lines: ['The exercise: hangs.'], loadTable: null, loadTableNote: null },
  population: { status: null, injured: false } as VersionSnapshot['population'],
  verdict: {
    key: 'supported',
    label: 'Holds up',
    outcomeProbability: 0.86,
    outcomeTerm: 'likely',
    summary: 'It holds.',
  },
  mechanisms: [],
  recommendations: { whoMightTry: '', whoShouldNot: '', whatInstead: '' },
  bodyHtml: '',
  bodyText: '',
  references: [],
  team: { id: 1, name: 'Granite Hollow Training Lab', slug: 'granite-hollow' },
  authors: ['Tobias Wren'],
  effort: null,
};
const page = (s: VersionSnapshot): VerdictPageDTO => ({
  slug: 'light-daily-hangs',
  reviewId: 1,
  teamId: 1,
  visibility: 'public',
  withdrawn: null,
  version: { number: 1, publishedAt: '2026-12-01T10:00:00.000Z', publishedBy: 'Maren Holt', changeNote: null },
  latestNumber: 1,
  versions: [],
  snapshot: s,
});
const render = (s: VersionSnapshot) =>
  renderToStaticMarkup(createElement(VerdictArticle, { page: page(s), latest: true }));

describe('the verdict page and what a verdict rests on', () => {
  it('shows the words the version was published with', () => {
    const html = render({
      ...snapshot,
      robustness: {
        restsOn: 'This verdict rests on one study above all: Hale (2021).',
        wouldChange: 'It would change if that study were set aside.',
        fragility: 1,
        pivotal: [{ studyId: 4, citation: 'Hale (2021)' }],
      },
    });
    expect(html).toContain('How firm is this verdict?');
    expect(html).toContain('This verdict rests on one study above all: Hale (2021).');
    expect(html).toContain('It would change if that study were set aside.');
  });

  it('still renders a version published before, without the section', () => {
    const html = render(snapshot);
    expect(html).toContain('Light daily hangs make fingers stronger');
    expect(html).not.toContain('How firm is this verdict?');
  });
});

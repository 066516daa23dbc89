import { describe, expect, it } from 'vitest';
import fixture from '@/fixtures/search/reviews.json';
import { newIndex, searchIndex, type ReviewDoc, type SearchDoc } from '@/lib/search/documents';

// The fixture's reviews as workbench search documents (no database: this tests the ranking itself).
const docs: SearchDoc[] = fixture.reviews.map((r): ReviewDoc => ({
  kind: 'review',
  key: `review:${r.id}`,
  id: r.id,
  teamId: 1,
  reviewId: r.id,
  title: r.title,
  claim: r.claim,
  tags: r.tags,
  mechanisms: r.mechanisms,
  body: r.body,
  status: 'published',
  verdict: null,
  slug: `r-${r.id}`,
}));

describe('search ranking on the fixture of reviews', () => {
  const index = newIndex(docs);

  it.each(fixture.queries)('"$q" finds review $expect first ($why)', ({ q, expect: id }) => {
    const hits = searchIndex(index, q, { kind: 'review' });
    expect(hits[0]?.doc.id).toBe(id);
  });

  it('a query that matches nothing returns nothing rather than noise', () => {
    expect(searchIndex(index, 'zqxvjw')).toEqual([]);
  });

  it('returns matched ranges that point at the matched text, for highlighting', () => {
    const [hit] = searchIndex(index, 'plunge');
    const claim = hit.matches.find((m) => m.key === 'claim' || m.key === 'title');
    expect(claim).toBeDefined();
    const [start, end] = claim!.indices.find(([a, b]) => b - a >= 3)!;
    expect(claim!.value.slice(start, end + 1).toLowerCase()).toContain('plunge');
  });

  it('filters by status, verdict and tag', () => {
    expect(searchIndex(index, 'fingers', { tag: 'supplement' }).map((h) => h.doc.id)).toEqual([9]);
    expect(searchIndex(index, 'fingers', { status: 'draft' })).toEqual([]);
  });

  it('the index is updated in place: a removed review is no longer found, an added one is', () => {
    const local = newIndex([...docs]);
    local.remove('review:12');
    expect(searchIndex(local, 'sleep').map((h) => h.doc.id)).not.toContain(12);
    local.upsert({ ...(docs[11] as ReviewDoc), id: 99, key: 'review:99', title: 'Naps and sleep debt' });
    expect(searchIndex(local, 'slep')[0].doc.id).toBe(99);
  });
});

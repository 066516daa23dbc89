import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FuzzyIndex, type FieldSpec } from '@/lib/search/engine';

interface Doc {
  key: string;
  title: string;
  body: string;
}
const FIELDS: FieldSpec<Doc>[] = [
  { name: 'title', weight: 3, get: (d) => d.title },
  { name: 'body', weight: 1, get: (d) => d.body },
];
const make = (docs: Doc[] = []) => new FuzzyIndex<Doc>(FIELDS, (d) => d.key, docs);
// Words under four letters are matched exactly (no fuzzy expansion), so a brute-force scan can say
// which documents must come back and in which order of field weight.
const VOCAB = ['ox', 'elk', 'yak', 'emu', 'gnu', 'ram', 'cod', 'eel'];
const words = fc.array(fc.constantFrom(...VOCAB), { minLength: 1, maxLength: 4 }).map((w) => w.join(' '));

describe('the fuzzy index behind search', () => {
  it('finds a word through a typo and ranks a title match above a body match', () => {
    const index = make([
      { key: 'a', title: 'Pulley strain in climbers', body: 'fingers' },
      { key: 'b', title: 'Fingers', body: 'a pulley strain story' },
      { key: 'c', title: 'Deadlift', body: 'hips' },
    ]);
    expect(index.search('puley').map((h) => h.doc.key)).toEqual(['a', 'b']);
    expect(index.search('deadlfit').map((h) => h.doc.key)).toEqual(['c']);
  });

  it('a replaced or removed document never comes back in its old form, and freed slots are reused safely', () => {
    const index = make([
      { key: 'a', title: 'elk', body: '' },
      { key: 'b', title: 'yak', body: '' },
    ]);
    index.upsert({ key: 'a', title: 'emu', body: '' });
    expect(index.search('elk')).toEqual([]);
    expect(index.search('emu').map((h) => h.doc.key)).toEqual(['a']);
    index.remove('b');
    index.upsert({ key: 'c', title: 'gnu', body: '' }); // takes b's freed slot
    expect(index.search('yak')).toEqual([]);
    expect(index.search('gnu').map((h) => h.doc.key)).toEqual(['c']);
    expect(index.size).toBe(2);
  });

  it('when the filter drops the best matches, the next best fill the page', () => {
    const docs = Array.from({ length: 50 }, (_, i) => ({ key: `d${i}`, title: i < 40 ? 'elk' : 'x', body: 'elk' }));
    const index = make(docs);
    const hits = index.search('elk', { filter: (d) => Number(d.key.slice(1)) >= 40, limit: 5 });
    expect(hits.map((h) => h.doc.key)).toEqual(['d40', 'd41', 'd42', 'd43', 'd44']);
  });

  it('returns exactly the documents holding a query word, best score first, after any upserts and removals', () => {
    const doc = fc.record({ title: words, body: words });
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 0, max: 14 }), fc.option(doc, { nil: null })), { maxLength: 60 }),
        fc.constantFrom(...VOCAB),
        (ops, q) => {
          const index = make();
          const live = new Map<string, Doc>();
          for (const [k, d] of ops) {
            const key = `k${k}`;
            if (d === null) {
              index.remove(key);
              live.delete(key);
            } else {
              index.upsert({ key, ...d });
              live.set(key, { key, ...d });
            }
          }
          const has = (text: string) => text.split(' ').includes(q);
          const expected = [...live.values()].filter((d) => has(d.title) || has(d.body));
          const hits = index.search(q, { limit: 100 });
          // Asking again gives the same answer: nothing of one query's scoring leaks into the next.
          expect(index.search(q, { limit: 100 })).toEqual(hits);
          expect(new Set(hits.map((h) => h.doc.key))).toEqual(new Set(expected.map((d) => d.key)));
          for (let i = 1; i < hits.length; i++) expect(hits[i].score).toBeGreaterThanOrEqual(hits[i - 1].score);
          // A title holder (weight 3) always ranks above a body-only holder (weight 1).
          const firstBodyOnly = hits.findIndex((h) => !has(h.doc.title));
          if (firstBodyOnly >= 0) expect(hits.slice(firstBodyOnly).every((h) => !has(h.doc.title))).toBe(true);
        },
      ),
      { numRuns: 200 },
    );
  });
});

/**
 * Benchmark (not a test): the memory one app process spends on the search indexes of 20 teams
 * × 500 reviews (each with 4 mechanisms and a 2,000-character body excerpt, plus 300 library
 * studies per team), built with the same index code as lib/search/index-store.ts. Every process
 * behind nginx holds the indexes of the teams searched on it (docs/deployment.md).
 *
 *   node --expose-gc --import tsx bench/search-memory.ts
 */
import { BODY_CHARS, newIndex, type SearchDoc } from '../lib/search/documents';

const TEAMS = 20;
const REVIEWS = 500;
const MECHANISMS = 4;
const STUDIES = 300;
const words =
  'tendon stiffness finger strength hangboard isometric load volume rest deload sprint plyometric eccentric'.split(' ');
const text = (n: number, seed: number) =>
  Array.from({ length: n }, (_, i) => words[(seed * 7 + i * 13) % words.length]).join(' ');

function teamDocs(teamId: number): SearchDoc[] {
  const docs: SearchDoc[] = [];
  for (let r = 0; r < REVIEWS; r++) {
    const id = teamId * 10_000 + r;
    const mechanisms = Array.from({ length: MECHANISMS }, (_, m) => `Mechanism ${m} ${text(3, id + m)}`);
    docs.push({
      kind: 'review',
      key: `review:${id}`,
      id,
      teamId,
      reviewId: id,
      title: `Review ${id} ${text(6, id)}`,
      claim: text(25, id),
      tags: ['fingers', 'strength'],
      mechanisms,
      body: text(400, id).slice(0, BODY_CHARS),
      status: 'draft',
      verdict: null,
      slug: `review-${id}`,
    } as SearchDoc);
    mechanisms.forEach((name, m) =>
      docs.push({
        kind: 'mechanism',
        key: `mechanism:${id * 10 + m}`,
        id: id * 10 + m,
        teamId,
        reviewId: id,
        reviewTitle: `Review ${id}`,
        name,
        summary: text(30, id + m),
      } as SearchDoc),
    );
  }
  for (let s = 0; s < STUDIES; s++) {
    const id = teamId * 10_000 + s;
    docs.push({
      kind: 'study',
      key: `study:${id}`,
      id,
      teamId,
      title: text(12, id),
      citation: `Author ${s} et al. (2020)`,
      journal: 'J Invented Sport Sci',
      doi: `10.5555/bench.${id}`,
      tags: ['bench'],
    } as SearchDoc);
  }
  return docs;
}

const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error('Run with node --expose-gc --import tsx bench/search-memory.ts');
gc();
const before = process.memoryUsage();
const started = performance.now();
const indexes = Array.from({ length: TEAMS }, (_, t) => newIndex(teamDocs(t + 1)));
const built = performance.now() - started;
gc();
const after = process.memoryUsage();
const mb = (n: number) => (n / 1024 / 1024).toFixed(1);
console.log(
  `${TEAMS} teams × ${REVIEWS} reviews (+${MECHANISMS} mechanisms each, ${STUDIES} studies per team): ${indexes.length} indexes built in ${Math.round(built)} ms`,
);
console.log(
  `heap +${mb(after.heapUsed - before.heapUsed)} MB, RSS +${mb(after.rss - before.rss)} MB (process RSS ${mb(after.rss)} MB)`,
);

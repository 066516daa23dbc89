/**
 * Benchmark (not a test): fuzzy search over a generated 10,000 reviews, with the workbench's own
 * index code (lib/search/documents.ts: fuse.js token search, the same keys and options as
 * GET /api/search). The goal is a p95 of at most 25 ms per query.
 *
 *   npx tsx bench/search.ts [reviews] [queries]
 *
 * Each review has a title, claim, tags, three mechanism names and ~800 characters of body text
 * from a climbing/strength vocabulary; queries mix exact words, typos and two-word phrases. The
 * index is built once (timed separately), as the app does, and every query runs against it.
 */
import { performance } from 'node:perf_hooks';
import { newIndex, searchIndex, type ReviewDoc, type SearchDoc, type MechanismDoc } from '../lib/search/documents';

const N = Number(process.argv[2] ?? 10_000);
const QUERIES = Number(process.argv[3] ?? 400);
const GOAL_P95_MS = 25;

// A deterministic generator, so two runs search the same data.
let seed = 42;
const rand = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
const pick = <T>(xs: readonly T[]) => xs[Math.floor(rand() * xs.length)];

const EXERCISES = [
  'hangboard hang',
  'pinch block lift',
  'weighted pull-up',
  'campus ladder',
  'deadlift',
  'front lever',
  'finger roll',
  'wrist curl',
  'one-arm lock-off',
  'bench press',
  'sled push',
  'nordic curl',
];
const OUTCOMES = [
  'finger strength',
  'tendon stiffness',
  'lock-off strength',
  'grip endurance',
  'power',
  'elbow pain',
  'shoulder stability',
  'recovery',
  'bone density',
  'hypertrophy',
];
const PROMISES = ['doubles', 'triples', 'fixes', 'builds', 'blunts', 'thickens', 'speeds up', 'prevents'];
const SPANS = ['in three weeks', 'in a month', 'in six weeks', 'overnight', 'in ten days', 'by next season'];
const MECHS = [
  'Tendon stiffness',
  'Neural drive',
  'Muscle growth',
  'Capillary density',
  'Pain and threat',
  'Expectation',
  'Skill at the angle',
  'Connective-tissue remodelling',
  'Rate of force development',
  'Sleep',
  'Nutrition',
  'Concurrent training',
];
const TAGS = [
  'fingers',
  'tendon',
  'recovery',
  'rehab',
  'power',
  'endurance',
  'shoulder',
  'elbow',
  'pulling',
  'legs',
  'supplement',
  'mobility',
];
const WORDS =
  'load intensity effort sets sessions week athlete protocol evidence study trial appraisal certainty bias indirectness imprecision effect size meta-analysis forest plot climber boulder route crimp pinch sloper pocket rest recovery adaptation collagen fascicle pulley flexor extensor forearm scapula rotator cuff'.split(
    ' ',
  );

function review(i: number): ReviewDoc {
  const exercise = pick(EXERCISES);
  const outcome = pick(OUTCOMES);
  const body: string[] = [];
  while (body.join(' ').length < 800) body.push(pick(WORDS));
  return {
    kind: 'review',
    key: `review:${i}`,
    id: i,
    teamId: 1,
    reviewId: i,
    title: `${exercise} and ${outcome} #${i}`,
    claim: `Daily ${exercise} ${pick(PROMISES)} ${outcome} ${pick(SPANS)}`,
    tags: [pick(TAGS), pick(TAGS)],
    mechanisms: [pick(MECHS), pick(MECHS), pick(MECHS)],
    body: body.join(' '),
    status: pick(['draft', 'in-review', 'approved', 'published']),
    verdict: pick(['supported', 'not-supported', 'uncertain', 'insufficient', null]),
    slug: `r-${i}`,
  };
}

const QUERY_POOL = [
  'tendon stiffness',
  'tendn stifnes',
  'pinch blok',
  'lock-off',
  'lockof strenght',
  'capilary',
  'grip endurance',
  'campus',
  'deadlfit',
  'elbow pain',
  'colagen',
  'pulley',
  'nordic',
  'hypertrophy',
  'finger strenth',
  'recovery',
  'expectation',
  'front lever',
  'bone density',
  'wrist',
];

function percentile(sorted: number[], p: number) {
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

function run(label: string, docs: SearchDoc[]) {
  const t0 = performance.now();
  const index = newIndex(docs);
  const buildMs = performance.now() - t0;
  for (let i = 0; i < 20; i++) searchIndex(index, pick(QUERY_POOL)); // warm-up (JIT)
  const times: number[] = [];
  let found = 0;
  for (let i = 0; i < QUERIES; i++) {
    const q = pick(QUERY_POOL);
    const s = performance.now();
    const hits = searchIndex(index, q);
    times.push(performance.now() - s);
    if (hits.length) found++;
  }
  times.sort((a, b) => a - b);
  const p95 = percentile(times, 95);
  console.log(
    `${label}: ${docs.length} documents, index built in ${buildMs.toFixed(0)} ms; ${QUERIES} queries: ` +
      `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${p95.toFixed(1)} ms, p99 ${percentile(times, 99).toFixed(1)} ms, ` +
      `max ${times[times.length - 1].toFixed(1)} ms; ${found}/${QUERIES} queries found something. ` +
      `Goal p95 ≤ ${GOAL_P95_MS} ms: ${p95 <= GOAL_P95_MS ? 'met' : 'NOT met'}.`,
  );
}

const reviews = Array.from({ length: N }, (_, i) => review(i + 1));
run('reviews only', reviews);
// The team index also holds each review's mechanisms as their own documents (GET /api/search).
const mechanisms: MechanismDoc[] = reviews.flatMap((r) =>
  r.mechanisms.map((name, j) => ({
    kind: 'mechanism' as const,
    key: `mechanism:${r.id}-${j}`,
    id: r.id * 10 + j,
    teamId: 1,
    reviewId: r.id,
    reviewTitle: r.title,
    name,
    summary: '',
  })),
);
run('reviews + their mechanisms', [...reviews, ...mechanisms]);

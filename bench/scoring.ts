/**
 * Benchmark of the scoring engine: scoreReview on 50 mechanisms × 2,000 appraisals each
 * (plus 2,000 outcome appraisals) and metaAnalysis on 1,000 studies. Goals: ≤ 5 ms and ≤ 2 ms
 * per call on the development machine. A script, not a test: it prints, it does not assert.
 *
 *     npx tsx bench/scoring.ts
 *
 * @example
 * // npx tsx bench/scoring.ts
 * // scoreReview (50 × 2,000)   median 3.1 ms   p95 3.9 ms   goal ≤ 5 ms   ok
 */
import { performance } from 'node:perf_hooks';
import { scoreReview, type ReviewInput } from '../lib/scoring/verdict';
import { metaAnalysis } from '../lib/stats/meta-analysis';
import type { Appraisal } from '../lib/scoring/types';
import { mulberry32 } from './seeded-random';

const WARMUP = 30;
const RUNS = 300;

const random = mulberry32(20240603);
const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)];
const directions = ['supports', 'against', 'neutral'] as const;
const certainties = ['high', 'moderate', 'low', 'very-low'] as const;
const efforts = ['easy', 'moderate', 'hard', 'to-failure'] as const;
const magnitudes = ['none', 'small', 'moderate', 'large'] as const;

const appraisals = (n: number): Appraisal[] =>
  Array.from({ length: n }, () => ({
    direction: pick(directions),
    certainty: pick(certainties),
    applicability: random(),
  }));

const review: ReviewInput = {
  protocol: { intensity: 0.4, effort: 'moderate' },
  outcome: { prior: 0.5, evidence: appraisals(2000) },
  mechanisms: Array.from({ length: 50 }, (_, i) => ({
    id: `mechanism-${i + 1}`,
    stated: i < 2,
    prior: 0.05 + 0.9 * random(),
    minIntensity: random(),
    minEffort: pick(efforts),
    magnitude: pick(magnitudes),
    evidence: appraisals(2000),
  })),
};

const studies = Array.from({ length: 1000 }, () => ({ yi: random() * 2 - 1, vi: 0.01 + random() * 0.5 }));

function measure(run: () => unknown): { median: number; p95: number; min: number } {
  for (let i = 0; i < WARMUP; i += 1) run();
  const times: number[] = [];
  for (let i = 0; i < RUNS; i += 1) {
    const start = performance.now();
    run();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  const at = (q: number) => times[Math.min(times.length - 1, Math.ceil(q * times.length) - 1)];
  return { median: at(0.5), p95: at(0.95), min: times[0] };
}

const cases: { name: string; goal: number; run: () => unknown }[] = [
  { name: 'scoreReview (50 mechanisms × 2,000 appraisals)', goal: 5, run: () => scoreReview(review) },
  { name: 'metaAnalysis DL (1,000 studies)', goal: 2, run: () => metaAnalysis(studies) },
  { name: 'metaAnalysis REML (1,000 studies)', goal: 2, run: () => metaAnalysis(studies, { method: 'REML' }) },
  { name: 'metaAnalysis fixed (1,000 studies)', goal: 2, run: () => metaAnalysis(studies, { method: 'fixed' }) },
];

const ms = (x: number) => `${x.toFixed(3)} ms`;
const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

console.log(`Loadbearing scoring benchmark — node ${process.version}, ${WARMUP} warm-up + ${RUNS} timed runs each`);
console.log(
  `Review: ${review.mechanisms.length} mechanisms × 2,000 appraisals + 2,000 outcome appraisals (${
    review.mechanisms.reduce((n, m) => n + m.evidence.length, 0) + review.outcome.evidence.length
  } appraisals)`,
);
for (const c of cases) {
  const { median, p95, min } = measure(c.run);
  const verdict = median <= c.goal ? 'ok' : 'over goal';
  console.log(
    `${c.name.padEnd(48)} median ${ms(median).padStart(10)}   p95 ${ms(p95).padStart(10)}   min ${ms(min).padStart(10)}   goal ≤ ${c.goal} ms (median): ${verdict}`,
  );
}
const memory = process.memoryUsage();
console.log(`heap used ${mb(memory.heapUsed)} of ${mb(memory.heapTotal)} allocated; rss ${mb(memory.rss)}`);

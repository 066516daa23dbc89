/**
 * Benchmark of the robustness report (docs/scoring.md §9): a review of 30 studies, 12 mechanisms
 * and 300 appraisals whose verdict survives every single study and every pair left out, so the
 * fragility search runs all 435 pairs (plus 30 single studies and 600 certainty shifts).
 * Goal: ≤ 50 ms per call on the development machine. A script, not a test: it prints, it does
 * not assert.
 *
 *     npx tsx bench/robustness.ts
 *
 * @example
 * // npx tsx bench/robustness.ts
 * // robustness (30 studies, 12 mechanisms, 300 appraisals)   median 4.1 ms   p95 5.0 ms   CPU 4.0 ms per call   goal ≤ 50 ms   ok
 */
import { performance } from 'node:perf_hooks';
import { robustness } from '../lib/scoring/robustness';
import type { ReviewInput } from '../lib/scoring/verdict';
import type { Appraisal } from '../lib/scoring/types';
import { mulberry32 } from './seeded-random';

const WARMUP = 20;
const RUNS = 200;
const STUDIES = 30;
const MECHANISMS = 12;
const OUTCOME_APPRAISALS = 60;
const PER_MECHANISM = 20; // 60 + 12 × 20 = 300 appraisals

const random = mulberry32(20261202);
const certainties = ['high', 'moderate', 'low', 'very-low'] as const;
let next = 0;
/** Mostly supporting appraisals, spread over the 30 studies in turn. */
const appraisals = (n: number): Appraisal[] =>
  Array.from({ length: n }, () => ({
    studyId: `study-${(next++ % STUDIES) + 1}`,
    direction: random() < 0.8 ? 'supports' : random() < 0.5 ? 'against' : 'neutral',
    certainty: certainties[Math.floor(random() * certainties.length)],
    applicability: 0.5 + 0.5 * random(),
  }));

const review: ReviewInput = {
  protocol: { intensity: 0.6, effort: 'hard' },
  outcome: { evidence: appraisals(OUTCOME_APPRAISALS) },
  mechanisms: Array.from({ length: MECHANISMS }, (_, i) => ({
    id: `mechanism-${i + 1}`,
    stated: i < 2,
    minIntensity: 0.5,
    evidence: appraisals(PER_MECHANISM),
  })),
};

const check = robustness(review);
const pairs = (STUDIES * (STUDIES - 1)) / 2;
console.log(
  `verdict ${check.verdict}, ${check.leaveOneOut.length} studies, fragility ${check.fragility ?? 'none'} ` +
    `(${check.fragility === null ? `all ${pairs} pairs searched` : 'the search stopped early: the bench review is not the worst case'}), ` +
    `${check.certaintyShifts.length} certainty shifts`,
);

for (let i = 0; i < WARMUP; i += 1) robustness(review);
const times: number[] = [];
const cpuStart = process.cpuUsage();
for (let i = 0; i < RUNS; i += 1) {
  const start = performance.now();
  robustness(review);
  times.push(performance.now() - start);
}
// CPU time as well as wall time: on a shared machine the wall clock also counts the time the
// process waited for a core.
const cpu = process.cpuUsage(cpuStart);
const cpuPerCall = (cpu.user + cpu.system) / 1000 / RUNS;
times.sort((a, b) => a - b);
const at = (q: number) => times[Math.min(times.length - 1, Math.ceil(q * times.length) - 1)];
const goal = 50;
console.log(
  `robustness (${STUDIES} studies, ${MECHANISMS} mechanisms, 300 appraisals)   median ${at(0.5).toFixed(1)} ms   ` +
    `p95 ${at(0.95).toFixed(1)} ms   CPU ${cpuPerCall.toFixed(1)} ms per call   goal ≤ ${goal} ms   ` +
    `${at(0.5) <= goal ? 'ok' : 'OVER'}`,
);

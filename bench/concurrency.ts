/**
 * Benchmark (not a test): writes at the same moment against a production build, the way a busy
 * team uses it. Starts the production build with `npm start`'s server on a fresh seeded database
 * (bench/lib/production.ts, which builds first if there is no build), then measures:
 * - 20 and 100 saves of one review from the same (stale) version at once: how many 200, 409, 5xx,
 *   and the p50 / p99 of an unrelated GET /api/me sent every 10 ms during the burst;
 * - 50 appraisals created at once: how many 201 and 5xx, and whether every 201 is in the database.
 *
 *   npx tsx bench/concurrency.ts
 */
import { newReview as reviewInput } from '../tests/helpers/review-input';
import { startProduction } from './lib/production';

const percentile = (values: number[], p: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
};

async function main() {
  const app = await startProduction({ name: 'bench-concurrency' });
  const base = app.url;
  try {
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'owner@granite-hollow.test', password: 'loadbearing-demo' }),
    });
    const cookie = signIn.headers.getSetCookie()[0].split(';')[0];
    const call = (method: string, p: string, body?: unknown) =>
      fetch(`${base}${p}`, {
        method,
        headers: { cookie, ...(body ? { 'content-type': 'application/json' } : {}) },
        body: body ? JSON.stringify(body) : undefined,
      });
    const me = await (await call('GET', '/api/me')).json();
    const teamId = me.teams[0].id;
    const newReview = async (title: string) =>
      (await (await call('POST', '/api/reviews', reviewInput(teamId, { title }))).json()).review;

    for (const n of [20, 100]) {
      const review = await newReview(`Bench stale saves ${n}`);
      const latencies: number[] = [];
      let bursting = true;
      const prober = (async () => {
        while (bursting) {
          const started = performance.now();
          await call('GET', '/api/me');
          latencies.push(performance.now() - started);
          await new Promise((r) => setTimeout(r, 10));
        }
      })();
      const started = performance.now();
      const statuses = await Promise.all(
        Array.from({ length: n }, (_, i) =>
          call('PATCH', `/api/reviews/${review.id}`, { version: review.version, title: `Save ${i}` }).then(
            (r) => r.status,
          ),
        ),
      );
      const burstMs = performance.now() - started;
      bursting = false;
      await prober;
      const count = (s: number) => statuses.filter((x) => x === s).length;
      console.log(
        `${n} stale saves: ${count(200)} × 200, ${count(409)} × 409, ${statuses.filter((s) => s >= 500).length} × 5xx ` +
          `in ${burstMs.toFixed(0)} ms; GET /api/me during the burst (${latencies.length} calls): ` +
          `p50 ${percentile(latencies, 50).toFixed(1)} ms, p99 ${percentile(latencies, 99).toFixed(1)} ms`,
      );
    }

    const review = await newReview('Bench appraisals');
    const studyIds: number[] = [];
    for (let i = 0; i < 50; i++) {
      const res = await call('POST', '/api/studies', {
        teamId,
        title: `Bench study ${i}`,
        year: 2001 + (i % 20),
        design: 'cohort',
      });
      studyIds.push((await res.json()).studies[0].id);
    }
    const created = await Promise.all(
      studyIds.map((studyId) =>
        call('POST', `/api/reviews/${review.id}/appraisals`, {
          studyId,
          mechanismId: null,
          direction: 'supports',
        }).then(async (r) => ({ status: r.status, id: r.status === 201 ? (await r.json()).appraisal.id : null })),
      ),
    );
    const workbench = await (await call('GET', `/api/reviews/${review.id}`)).json();
    const stored = new Set(workbench.appraisals.map((a: { id: number }) => a.id));
    const ok = created.filter((c) => c.status === 201);
    console.log(
      `50 appraisals at once: ${ok.length} × 201, ${created.filter((c) => c.status >= 500).length} × 5xx; ` +
        `${ok.filter((c) => stored.has(c.id)).length} of the 201s are in the database`,
    );
  } finally {
    await app.stop();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

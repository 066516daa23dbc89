/**
 * Benchmark (not a test): writes at the same moment against a production build, the way a busy
 * team uses it. Starts the production build with `npm start`'s server on a fresh seeded database
 * (bench/lib/production.ts, which builds first if there is no build), then measures:
 * - bursts of 20 (ten times) and 100 (three times) saves of one review from the same version at
 *   once: how many 200, 409, 5xx (one 200 a burst), and the p50 / p99 of an unrelated GET /api/me
 *   sent every 10 ms during the bursts;
 * - 50 appraisals created at once: how many 201 and 5xx, and whether every 201 is in the database.
 *
 *   npx tsx bench/concurrency.ts
 */
import http from 'node:http';
import { newReview as reviewInput } from '../tests/helpers/review-input';
import { signInDemo, startProduction } from './lib/production';

const percentile = (values: number[], p: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
};

async function main() {
  const app = await startProduction({ name: 'bench-concurrency' });
  const base = app.url;
  try {
    const { cookie, call } = await signInDemo(base);
    const me = await (await call('GET', '/api/me')).json();
    const teamId = me.teams[0].id;
    const newReview = async (title: string) =>
      (await (await call('POST', '/api/reviews', reviewInput(teamId, { title }))).json()).review;

    // The unrelated GET goes over its own kept-alive connection (node:http, not fetch's pool) so
    // it never queues behind the burst's sockets in this client; bursts repeat so the p99 rests on
    // enough calls (one burst of 20 lasts well under a second).
    const probeAgent = new http.Agent({ keepAlive: true, maxSockets: 1 });
    const probe = () =>
      new Promise<void>((resolve, reject) => {
        const req = http.get(`${base}/api/me`, { agent: probeAgent, headers: { cookie } }, (res) => {
          res.resume();
          res.on('end', () =>
            res.statusCode === 200 ? resolve() : reject(new Error(`GET /api/me ${res.statusCode}`)),
          );
        });
        req.on('error', reject);
      });
    await probe();
    for (const [n, bursts] of [
      [20, 10],
      [100, 3],
    ] as const) {
      const review = await newReview(`Bench stale saves ${n}`);
      let version = review.version as number;
      const latencies: number[] = [];
      const statuses: number[] = [];
      const burstTimes: number[] = [];
      for (let b = 0; b < bursts; b++) {
        let bursting = true;
        const prober = (async () => {
          while (bursting) {
            const started = performance.now();
            await probe();
            latencies.push(performance.now() - started);
            await new Promise((r) => setTimeout(r, 10));
          }
        })();
        const started = performance.now();
        const answers = await Promise.all(
          Array.from({ length: n }, (_, i) =>
            call('PATCH', `/api/reviews/${review.id}`, { version, title: `Save ${b}.${i}` }).then(async (r) => ({
              status: r.status,
              body: await r.json(),
            })),
          ),
        );
        burstTimes.push(performance.now() - started);
        bursting = false;
        await prober;
        statuses.push(...answers.map((a) => a.status));
        version = answers.find((a) => a.status === 200)?.body.review.version ?? version;
        await new Promise((r) => setTimeout(r, 200));
      }
      const count = (s: number) => statuses.filter((x) => x === s).length;
      console.log(
        `${bursts} bursts of ${n} stale saves: ${count(200)} × 200, ${count(409)} × 409, ` +
          `${statuses.filter((s) => s >= 500).length} × 5xx; a burst took median ` +
          `${percentile(burstTimes, 50).toFixed(0)} ms; GET /api/me during the bursts (${latencies.length} calls): ` +
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

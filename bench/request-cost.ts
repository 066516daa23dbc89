/**
 * Benchmark (not a test): the server's CPU per request, one request at a time, against a
 * production build (bench/lib/production.ts). Read from /proc/<pid>/stat (user + system time of
 * every thread of the server), so it does not depend on how long a request waited for a core.
 * It bounds what any queueing can do: a burst of N requests costs the one Node process at least
 * N × its CPU per request before the last answer, whatever order it works in.
 *
 *   npx tsx bench/request-cost.ts [requests]
 */
import { readFileSync } from 'node:fs';
import { newReview as reviewInput } from '../tests/helpers/review-input';
import { signInDemo, startProduction } from './lib/production';

const REQUESTS = Number(process.argv[2] ?? 200);
const TICK_MS = 10; // USER_HZ is 100 on Linux

function cpuMs(pid: number): number {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return (Number(fields[11]) + Number(fields[12])) * TICK_MS;
}

async function main() {
  const app = await startProduction({ name: 'bench-request-cost' });
  const base = app.url;
  try {
    const { call: signedIn } = await signInDemo(base);
    const call = (method: string, p: string, body?: unknown, asSignedIn = true) =>
      asSignedIn
        ? signedIn(method, p, body)
        : fetch(`${base}${p}`, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
    const me = await (await call('GET', '/api/me')).json();
    const review = (await (await call('POST', '/api/reviews', reviewInput(me.teams[0].id, { title: 'Cost' }))).json())
      .review;
    // Saved once, so version 1 is stale from here on.
    await call('PATCH', `/api/reviews/${review.id}`, { version: review.version, title: 'Cost, saved' });
    const kinds: Array<[string, () => Promise<Response>]> = [
      ['GET /api/me', () => call('GET', '/api/me')],
      ['GET /api/reviews/:id (workbench)', () => call('GET', `/api/reviews/${review.id}`)],
      [
        'PATCH /api/reviews/:id, stale (409)',
        () => call('PATCH', `/api/reviews/${review.id}`, { version: 1, title: 'A stale title' }),
      ],
      [
        'PATCH /api/reviews/:id, signed out (401)',
        () => call('PATCH', `/api/reviews/${review.id}`, { version: 1 }, false),
      ],
    ];
    console.log(`load average ${readFileSync('/proc/loadavg', 'utf8').split(' ')[0]}; ${REQUESTS} requests each`);
    for (const [name, send] of kinds) {
      for (let i = 0; i < 20; i++) await (await send()).arrayBuffer();
      const cpu = cpuMs(app.pid);
      const started = performance.now();
      let status = 0;
      for (let i = 0; i < REQUESTS; i++) {
        const res = await send();
        status = res.status;
        await res.arrayBuffer();
      }
      const perCpu = (cpuMs(app.pid) - cpu) / REQUESTS;
      const perWall = (performance.now() - started) / REQUESTS;
      console.log(`${name} → ${status}: server CPU ${perCpu.toFixed(1)} ms, wall ${perWall.toFixed(1)} ms per request`);
    }
  } finally {
    await app.stop();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

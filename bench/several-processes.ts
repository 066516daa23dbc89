/**
 * Benchmark (not a test): the deployment of docs/deployment.md on this machine — nginx with
 * deploy/nginx/loadbearing.conf in front of two `npm start` processes on PostgreSQL and the S3
 * fake (tests/helpers/stack.ts). Measures:
 *   1. the signed-out verdict page through the proxy against a static file of the same size
 *      served by the same nginx, autocannon at 64 connections (goal: ≥ 0.8 × its throughput,
 *      p99 < 100 ms);
 *   2. withdraw (or publish) on one process → every reader through the proxy sees it: the
 *      largest delay over several rounds (goal ≤ 2 s);
 *   3. 16 coaches autosaving their reviews (PATCH with the version read) for SAVE_SECONDS on
 *      PostgreSQL through the proxy and on SQLite: errors other than 409, p99 of a save (goal
 *      < 150 ms), once back to back (a stress test) and once at the workbench's autosave pace.
 *
 *   npm run build && npx tsx bench/several-processes.ts [seconds per page run] [save seconds] [saves]
 */
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { startStack, type Stack } from '../tests/helpers/stack';
import { AUTOSAVE_DELAY_MS } from '../components/editor/use-autosave';
import { coachSaves, signIn, type SaveFigures } from './save-load';
import { autocannon, type CannonResult } from './lib/autocannon';
import { startProduction } from './lib/production';

const SECONDS = Number(process.argv[2] ?? 10);
const SAVE_SECONDS = Number(process.argv[3] ?? 30);
const SLUG = 'cold-plunges-after-strength';

async function pageVersusStatic(stack: Stack) {
  const html = await (await fetch(`${stack.url}/v/${SLUG}`)).text();
  writeFileSync(path.join(stack.staticDir, 'page.html'), html);
  const run = async (url: string) => {
    await autocannon({ url, connections: 64, duration: 2 });
    return autocannon({ url, connections: 64, duration: SECONDS });
  };
  const page = await run(`${stack.url}/v/${SLUG}`);
  const file = await run(`${stack.url}/static/page.html`);
  const line = (name: string, r: CannonResult) =>
    `${name}: ${Math.round(r.requests.average)} req/s, p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms, ${r.non2xx} non-2xx, ${r.errors} errors`;
  const ratio = page.requests.average / file.requests.average;
  console.log(
    `1. signed-out verdict page through nginx, two app processes (${html.length} bytes), 64 connections, ${SECONDS} s:`,
  );
  console.log(`   ${line(`/v/${SLUG}`, page)}`);
  console.log(`   ${line('static file of the same size', file)}`);
  console.log(
    `   ratio ${ratio.toFixed(2)} (goal ≥ 0.8: ${ratio >= 0.8 ? 'met' : 'NOT met'}); page p99 ${page.latency.p99} ms (goal < 100 ms: ${page.latency.p99 < 100 ? 'met' : 'NOT met'})`,
  );
}

async function staleness(stack: Stack) {
  const client = new pg.Client({ connectionString: stack.databaseUrl });
  await client.connect();
  const { reviewId } = (await client.query('SELECT "reviewId" FROM publications WHERE slug = $1', [SLUG])).rows[0];
  await client.end();
  const cookie = await signIn(stack.apps[0], 'owner@granite-hollow.test');
  const post = (pathname: string, json: unknown) =>
    fetch(`${stack.apps[0]}${pathname}`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', cookie, origin: stack.apps[0] },
      body: JSON.stringify(json),
    });
  // Readers keep the page hot in nginx's cache meanwhile, as real traffic would.
  let reading = true;
  const readers = Array.from({ length: 8 }, async () => {
    while (reading) await fetch(`${stack.url}/v/${SLUG}`).then((r) => r.arrayBuffer());
  });
  const delays: number[] = [];
  for (let round = 1; round <= 6; round++) {
    const withdraw = round % 2 === 1;
    const marker = withdraw ? `Withdrawn in round ${round}.` : `Published again in round ${round}.`;
    const res = withdraw
      ? await post(`/api/reviews/${reviewId}/unpublish`, { reason: marker })
      : await post(`/api/reviews/${reviewId}/publish`, { visibility: 'public', changeNote: marker });
    const acknowledged = Date.now();
    if (res.status >= 300) throw new Error(`round ${round}: ${res.status} ${await res.text()}`);
    while (!(await (await fetch(`${stack.url}/v/${SLUG}`)).text()).includes(marker)) {
      if (Date.now() - acknowledged > 10_000) throw new Error(`round ${round}: not seen after 10 s`);
      await new Promise((r) => setTimeout(r, 10));
    }
    delays.push(Date.now() - acknowledged);
    await new Promise((r) => setTimeout(r, 300));
  }
  reading = false;
  await Promise.all(readers);
  const worst = Math.max(...delays);
  console.log(
    `2. publish/withdraw on one process → seen through nginx: ${delays.join(', ')} ms (largest ${worst} ms; goal ≤ 2000 ms: ${worst <= 2000 ? 'met' : 'NOT met'})`,
  );
}

export function printSaves(label: string, f: SaveFigures, cpuMs?: number) {
  const cpu =
    cpuMs === undefined ? '' : `; app processes' CPU ${(cpuMs / Math.max(1, f.saves)).toFixed(1)} ms per save`;
  console.log(
    `3. ${label}: 16 coaches × ${SAVE_SECONDS} s: ${f.saves} saves, ${f.conflicts} honest 409s, ${f.errors} other errors, p50 ${f.p50} ms, p99 ${f.p99} ms (goal < 150 ms: ${f.p99 < 150 ? 'met' : 'NOT met'})${cpu}${f.errors ? `; errors: ${JSON.stringify(f.errorKinds)}` : ''}`,
  );
}

/** CPU time (user + system) the processes have used so far, in ms, from /proc (Linux). */
function cpuMsOf(pids: number[]): number {
  const tick = 1000 / 100; // USER_HZ is 100 on Linux
  return pids.reduce((sum, pid) => {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8')
      .replace(/^.*\) /, '')
      .split(' ');
    return sum + (Number(fields[11]) + Number(fields[12])) * tick;
  }, 0);
}

/** The autosave load, with the CPU the app processes spent on it (sign-ins and setup included). */
async function measuredSaves(base: string, pids: number[], pauseMs = 0) {
  const before = cpuMsOf(pids);
  const figures = await coachSaves(base, SAVE_SECONDS, pauseMs);
  return { figures, cpuMs: cpuMsOf(pids) - before };
}

/** The same autosave load on the embedded default: one `npm start` on a SQLite file. */
async function sqliteSaves() {
  const app = await startProduction({ name: 'bench-sqlite' });
  try {
    for (const [pace, pauseMs] of PACES) {
      const { figures, cpuMs } = await measuredSaves(app.url, [app.pid], pauseMs);
      printSaves(`SQLite, one process, ${pace}`, figures, cpuMs);
    }
  } finally {
    await app.stop();
  }
}

/** Back to back (a stress far above the workbench's rate), then at the workbench's autosave pace. */
const PACES: [string, number][] = [
  ['back to back', 0],
  [`a save at most every ${AUTOSAVE_DELAY_MS / 1000} s per coach (the autosave delay)`, AUTOSAVE_DELAY_MS],
];

/** `… saves` as the third argument runs only part 3 (the autosave load). */
const SAVES_ONLY = process.argv[4] === 'saves';

async function main() {
  const stack = await startStack({ apps: 2 });
  try {
    if (!SAVES_ONLY) {
      await pageVersusStatic(stack);
      await staleness(stack);
    }
    for (const [pace, pauseMs] of PACES) {
      const { figures, cpuMs } = await measuredSaves(stack.url, stack.appPids, pauseMs);
      printSaves(`PostgreSQL, two processes behind nginx, ${pace}`, figures, cpuMs);
    }
  } finally {
    await stack.stop();
  }
  await sqliteSaves();
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

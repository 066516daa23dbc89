/**
 * Benchmark (not a test): one run of the evidence watch (lib/watch/run.ts) over a library of
 * 2,000 DOIs against the local registry fake (lib/citations/fake-crossref-server.ts), one request
 * at a time — the lookups, the cache writes, the study notices, the flags. The goal is at most
 * 60 s with no retry storm; every 200th DOI is retracted, and the fake answers 429 (Retry-After
 * 1 s) to a few lookups on the way, so the run also shows its back-off.
 *
 *   npx tsx bench/watch.ts [dois]
 *
 * Runs against a throwaway SQLite file in the system temp folder. Prints the time, the requests
 * the fake received (DOIs + the 429 retries, nothing more), and the most it saw in flight at once.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

const DOIS = Number(process.argv[2] ?? 2000);
const GOAL_SECONDS = 60;
const RATE_LIMITED = 3;

const dir = mkdtempSync(path.join(tmpdir(), 'loadbearing-bench-'));
process.env.DATABASE_URL = path.join(dir, 'bench.sqlite');
process.env.SESSION_SECRET ??= 'bench-secret-that-is-long-enough-for-iron-session-0';

async function main() {
  const { db } = await import('../lib/db');
  const { migrate } = await import('../db/migrate');
  await migrate(db());
  const { Study, Team } = await import('../models');
  const { startFakeCrossrefServer } = await import('../lib/citations/fake-crossref-server');
  const { runWatch } = await import('../lib/watch/run');

  const team = await Team.create({ name: 'Bench team', slug: 'bench-team' } as never);
  const rows = Array.from({ length: DOIS }, (_, i) => ({
    teamId: team.id,
    createdById: null,
    csl: { type: 'article-journal', title: `Generated study ${i}` },
    doi: `10.5555/bench.${i}`,
    title: `Generated study ${i}`,
    fingerprint: `generated study ${i}`,
    year: 2020,
    journal: null,
    citation: `Bench, ${i}`,
    design: null,
    population: null,
    n: null,
    intensity: null,
    durationWeeks: null,
    outcome: null,
    effect: null,
    tags: [],
    pdfKey: null,
  }));
  for (let i = 0; i < rows.length; i += 500) await Study.bulkCreate(rows.slice(i, i + 500));

  const fake = await startFakeCrossrefServer();
  process.env.CROSSREF_BASE_URL = fake.url;
  fake.setNotices(
    rows
      .filter((_, i) => i % 200 === 0)
      .map((r, i) => ({
        doi: r.doi,
        kind: 'retraction' as const,
        noticeDoi: `10.5555/bench.r${i}`,
        date: [2026, 11, 1] as [number, number, number],
      })),
  );
  fake.rateLimitNext(RATE_LIMITED, 1);

  const started = performance.now();
  const run = await runWatch(team.id, { trigger: 'schedule', maxAgeMs: 0 });
  const seconds = (performance.now() - started) / 1000;

  console.log(`Evidence watch over ${DOIS} DOIs against the local fake, one request at a time`);
  console.log(`  status ${run.status}${run.error ? ` (${run.error})` : ''}`);
  console.log(
    `  ${seconds.toFixed(2)} s (goal ≤ ${GOAL_SECONDS} s) — ${((seconds * 1000) / DOIS).toFixed(2)} ms a DOI`,
  );
  console.log(
    `  requests received: ${fake.requests} (${DOIS} DOIs + ${run.summary?.backoffs ?? 0} after 429 back-offs)`,
  );
  console.log(`  most in flight at once: ${fake.maxConcurrent}`);
  console.log(`  new notices: ${run.summary?.newNotices.length ?? 0}`);
  await fake.close();
  await db().close();
  rmSync(dir, { recursive: true, force: true });
  if (run.status !== 'done' || seconds > GOAL_SECONDS || fake.requests !== DOIS + RATE_LIMITED) process.exitCode = 1;
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

/**
 * Benchmark (not a test): importing a generated 2,000-entry BibTeX file through the real route
 * handler, POST /api/studies/import — multipart parsing, citation-js parsing, the duplicate
 * check and the inserts into SQLite. The goal (issue 4) is at most 10 s.
 *
 *   npx tsx bench/import.ts [entries] [runs]
 *
 * Runs against a throwaway SQLite file in the system temp folder; each run imports into a fresh
 * team so every entry is new. Prints the time of each run, with the progress lines the library
 * page would show (Accept: application/x-ndjson).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

const ENTRIES = Number(process.argv[2] ?? 2000);
const RUNS = Number(process.argv[3] ?? 3);
const GOAL_SECONDS = 10;

const dir = mkdtempSync(path.join(tmpdir(), 'loadbearing-bench-'));
process.env.DATABASE_URL = path.join(dir, 'bench.sqlite');
process.env.STORAGE_DIR = path.join(dir, 'uploads');
process.env.SESSION_SECRET ??= 'bench-secret-that-is-long-enough-for-iron-session-0';

/** A BibTeX library like a coach's export: three authors, journal, year, volume, pages, DOI. */
function generateBibtex(n: number, runTag: string): string {
  const parts: string[] = [];
  for (let i = 0; i < n; i++) {
    parts.push(
      `@article{bench${runTag}${i},\n` +
        `  author  = {Vale, Jonah and Lindqvist, Sofie and M{\\"u}ller-Sand, Jorunn},\n` +
        `  title   = {Grip Endurance and Finger-Flexor Loading, Generated Study {${i}}},\n` +
        `  journal = {Hollowridge Journal of Training Science},\n` +
        `  year    = {${2000 + (i % 25)}},\n  volume = {${1 + (i % 13)}},\n  number = {${1 + (i % 4)}},\n` +
        `  pages   = {${i}--${i + 9}},\n  doi = {10.5555/bench.${runTag}.${i}}\n}\n`,
    );
  }
  return parts.join('\n');
}

async function main() {
  const { db } = await import('../lib/db');
  const { migrate } = await import('../db/migrate');
  await migrate(db());
  const signUp = await import('../app/api/auth/sign-up/route');
  const importRoute = await import('../app/api/studies/import/route');

  const times: number[] = [];
  for (let run = 1; run <= RUNS; run++) {
    const res = await signUp.POST(
      new Request('http://bench.test/api/auth/sign-up', {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-forwarded-for': `10.99.0.${run}` },
        body: JSON.stringify({
          name: 'Bench Coach',
          email: `bench${run}@example.test`,
          password: 'bench-password-1',
          teamName: `Bench ${run}`,
        }),
      }),
    );
    const { team } = (await res.json()) as { team: { id: number } };
    const cookie = res.headers.getSetCookie()[0].split(';')[0];

    const text = generateBibtex(ENTRIES, String(run));
    const form = new FormData();
    form.set('teamId', String(team.id));
    form.set('file', new File([text], 'library.bib', { type: 'application/x-bibtex' }));
    const encoded = new Request('http://bench.test/', { method: 'POST', body: form });
    const body = new Uint8Array(await encoded.arrayBuffer());

    const started = performance.now();
    const response = await importRoute.POST(
      new Request('http://bench.test/api/studies/import', {
        method: 'POST',
        headers: {
          cookie,
          accept: 'application/x-ndjson',
          'content-type': encoded.headers.get('content-type')!,
          'content-length': String(body.byteLength),
        },
        body,
      }),
      { params: Promise.resolve({}) },
    );
    const lines = (await response.text())
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    const seconds = (performance.now() - started) / 1000;
    const result = lines.at(-1) as { type: string; results: { status: string }[] };
    const added = result.type === 'result' ? result.results.filter((r) => r.status === 'added').length : 0;
    const progress = lines.filter((l) => l.type === 'progress').map((l) => `${l.phase} ${l.done}/${l.total}`);
    times.push(seconds);
    console.log(
      `run ${run}: ${ENTRIES} entries (${(body.byteLength / 1024).toFixed(0)} KiB) → ${added} added in ${seconds.toFixed(2)} s; ` +
        `${progress.length} progress lines (first "${progress[0]}", last "${progress.at(-1)}")`,
    );
    if (added !== ENTRIES)
      throw new Error(`expected ${ENTRIES} added, got ${added}: ${JSON.stringify(lines.at(-1)).slice(0, 300)}`);
  }
  const sorted = [...times].sort((a, b) => a - b);
  const median = sorted[Math.floor(sorted.length / 2)];
  console.log(
    `\nmedian ${median.toFixed(2)} s, min ${sorted[0].toFixed(2)} s, max ${sorted.at(-1)!.toFixed(2)} s (goal ≤ ${GOAL_SECONDS} s)`,
  );
  await db().close();
  rmSync(dir, { recursive: true, force: true });
  if (sorted.at(-1)! > GOAL_SECONDS) process.exitCode = 1;
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

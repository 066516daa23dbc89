/**
 * Benchmark (not a test): the published verdict page /v/[slug] under load, against a static
 * file of similar size served by the same server (`npm start`'s: `next start`, no cache of our
 * own) in the same run; behind nginx, as deployed, see bench/several-processes.ts. Goal: the page's throughput at least 0.8 of the static
 * file's. Also measures the page's first-load JavaScript (every <script src> the page's HTML
 * loads, gzipped): goal ≤ 90 KB.
 *
 *   npm run build && npx tsx bench/verdict-page.ts [seconds per run]
 *
 * Uses the production build in .next, a throwaway seeded SQLite file, and autocannon (npm
 * `autocannon`) at 64 connections. The static file is written to public/ for the run (Next
 * lists public files when it starts) and removed afterwards.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

interface CannonResult {
  requests: { average: number; total: number };
  latency: { p99: number; p50: number; average: number };
  non2xx: number;
  errors: number;
}
const autocannon = createRequire(import.meta.url)('autocannon') as (
  opts: Record<string, unknown>,
) => Promise<CannonResult>;

const SECONDS = Number(process.argv[2] ?? 10);
const CONNECTIONS = 64;
const SLUG = 'cold-plunges-after-strength';

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const a = probe.address();
      const port = typeof a === 'object' && a ? a.port : 0;
      probe.close(() => resolve(port));
    });
  });
}

async function main() {
  const root = process.cwd();
  const work = mkdtempSync(path.join(tmpdir(), 'loadbearing-bench-page-'));
  const databaseFile = path.join(work, 'bench.sqlite');
  process.env.DATABASE_URL = databaseFile;
  process.env.ALLOW_DEMO_SEED = '1';
  const { db } = await import('../lib/db');
  const { migrate, seed } = await import('../db/migrate');
  await migrate(db());
  await seed(db());
  await db().close();

  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const staticName = `bench-static-${process.pid}.html`;
  const staticPath = path.join(root, 'public', staticName);
  // Placeholder until the page's size is known; rewritten below before the static run.
  writeFileSync(staticPath, 'x');
  // `npm start`'s server: `next start`, no cache of our own (the proxy's is measured in bench/several-processes.ts).
  const server = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'scripts/start.ts')], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      NEXT_TELEMETRY_DISABLED: '1',
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: databaseFile,
      SESSION_SECRET: 'bench-secret-that-is-long-enough-for-iron-session-00',
      APP_URL: base,
      SMTP_PORT: '1',
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  try {
    for (let i = 0; i < 120; i++) {
      try {
        if ((await fetch(`${base}/`)).status < 500) break;
      } catch {
        // not up yet
      }
      await new Promise((r) => setTimeout(r, 250));
    }
    const pageRes = await fetch(`${base}/v/${SLUG}`);
    if (pageRes.status !== 200) throw new Error(`/v/${SLUG} answered ${pageRes.status}`);
    const html = await pageRes.text();
    // Same size as the page's HTML, so the comparison is about rendering, not bytes on the wire.
    writeFileSync(
      staticPath,
      `<!doctype html><html><body><pre>${'x'.repeat(Math.max(0, html.length - 50))}</pre></body></html>`,
    );

    // What a current browser downloads: `nomodule` scripts (Next's legacy polyfills) are skipped by
    // every browser that runs modules, so they are not first-load JS.
    const scripts = [...html.matchAll(/<script[^>]+>/g)]
      .map((m) => m[0])
      .filter((tag) => !/\snomodule/i.test(tag))
      .map((tag) => /src="([^"]+)"/.exec(tag)?.[1])
      .filter((src): src is string => src !== undefined);
    let raw = 0;
    let gzipped = 0;
    for (const src of new Set(scripts)) {
      const body = Buffer.from(await (await fetch(new URL(src, base))).arrayBuffer());
      raw += body.length;
      gzipped += gzipSync(body, { level: 9 }).length;
    }

    const run = async (url: string) => {
      await autocannon({ url, connections: CONNECTIONS, duration: 2 }); // warm-up
      return autocannon({ url, connections: CONNECTIONS, duration: SECONDS });
    };
    const page = await run(`${base}/v/${SLUG}`);
    const file = await run(`${base}/${staticName}`);
    const ratio = page.requests.average / file.requests.average;
    console.log(`HTML of /v/${SLUG}: ${html.length} bytes; static file: ${html.length} bytes.`);
    console.log(
      `First-load JS: ${new Set(scripts).size} scripts, ${(raw / 1024).toFixed(1)} KB raw, ${(gzipped / 1024).toFixed(1)} KB gzipped (goal ≤ 90 KB: ${gzipped / 1024 <= 90 ? 'met' : 'NOT met'}).`,
    );
    const line = (label: string, r: CannonResult) =>
      `${label}: ${r.requests.average.toFixed(0)} req/s, p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms, ${r.non2xx} non-2xx, ${r.errors} errors`;
    console.log(`autocannon, ${CONNECTIONS} connections, ${SECONDS} s each:`);
    console.log(line(`  /v/${SLUG}`, page));
    console.log(line(`  /${staticName}`, file));
    console.log(
      `  ratio ${ratio.toFixed(2)} of the static file's throughput (goal ≥ 0.8: ${ratio >= 0.8 ? 'met' : 'NOT met'}).`,
    );
  } finally {
    // Stopped by its own PID.
    server.kill('SIGTERM');
    rmSync(staticPath, { force: true });
    rmSync(work, { recursive: true, force: true });
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

/**
 * Benchmark (not a test): the published verdict page /v/[slug] under load, against a static
 * file of similar size served by the same server (`npm start`'s: `next start`, no cache of our
 * own) in the same run; behind nginx, as deployed, see bench/several-processes.ts. Goal: the page's throughput at least 0.8 of the static
 * file's. Also measures the page's first-load JavaScript (every <script src> the page's HTML
 * loads, gzipped): goal ≤ 90 KB.
 *
 *   npm run build && npx tsx bench/verdict-page.ts [seconds per run]
 *
 * Uses the production build in .next on a throwaway seeded SQLite file (bench/lib/production.ts), and autocannon (npm
 * `autocannon`) at 64 connections. The static file is written to public/ for the run (Next
 * lists public files when it starts) and removed afterwards.
 */
import { rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { startProduction } from './lib/production';
import { autocannon, type CannonResult } from './lib/autocannon';

const SECONDS = Number(process.argv[2] ?? 10);
const CONNECTIONS = 64;
const SLUG = 'cold-plunges-after-strength';

async function main() {
  const staticName = `bench-static-${process.pid}.html`;
  const staticPath = path.join(process.cwd(), 'public', staticName);
  // Placeholder until the page's size is known; rewritten below before the static run.
  writeFileSync(staticPath, 'x');
  // `npm start`'s server: `next start`, no cache of our own (the proxy's is measured in bench/several-processes.ts).
  const app = await startProduction({ name: 'bench-page' });
  const base = app.url;
  try {
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
    await app.stop();
    rmSync(staticPath, { force: true });
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

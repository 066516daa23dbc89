/**
 * Benchmark (not a test): the JavaScript a browser downloads on the first visit of each page,
 * gzipped, read from the last `next build` (.next/).
 *
 *   npm run build && npx tsx bench/first-load-js.ts [--json]
 *
 * An App Router page loads the framework's root chunks (build-manifest.json `rootMainFiles`)
 * plus every chunk its segments' client components need (the page's client-reference manifest,
 * `entryJSFiles`: root layout, group layout, boundaries, page). Chunks loaded later (next/dynamic, a
 * dialog opened, a panel scrolled to) are not counted: that is the point of loading them later.
 * Sizes are gzip at level 9 of each file, summed, as a server with static compression sends them.
 */
import fs from 'node:fs';
import path from 'node:path';
import vm from 'node:vm';
import { gzipSync } from 'node:zlib';

const NEXT = path.resolve(process.cwd(), '.next');
const GOAL_WORKBENCH_KB = 300;

/** The pages people open most, by their route in .next/server/app. */
const APP_PAGES: Record<string, string> = {
  '/': '(marketing)/page',
  '/sign-in': '(auth)/sign-in/page',
  '/dashboard': '(app)/dashboard/page',
  '/reviews': '(app)/reviews/page',
  '/reviews/new': '(app)/reviews/new/page',
  '/reviews/[id]': '(app)/reviews/[id]/page',
  '/reviews/[id]/rounds': '(app)/reviews/[id]/rounds/page',
  '/reviews/[id]/round/[roundId]': '(app)/reviews/[id]/round/[roundId]/page',
  '/library': '(app)/library/page',
  '/library/[id]': '(app)/library/[id]/page',
  '/search': '(app)/search/page',
  '/team': '(app)/team/page',
  '/verdicts': '(app)/verdicts/page',
};

function readJson<T>(file: string): T {
  return JSON.parse(fs.readFileSync(path.join(NEXT, file), 'utf8')) as T;
}

const gzipped = new Map<string, number>();
function gzipSize(file: string): number {
  let size = gzipped.get(file);
  if (size === undefined) {
    size = gzipSync(fs.readFileSync(path.join(NEXT, file)), { level: 9 }).length;
    gzipped.set(file, size);
  }
  return size;
}

/** The client-reference manifest is a script that assigns to globalThis; run it in a sandbox. */
function entryFiles(route: string): string[] {
  const file = path.join(NEXT, 'server/app', `${route}_client-reference-manifest.js`);
  const sandbox = { globalThis: {} as Record<string, unknown> };
  vm.runInNewContext(fs.readFileSync(file, 'utf8'), sandbox);
  const all = (sandbox.globalThis.__RSC_MANIFEST ?? {}) as Record<string, { entryJSFiles?: Record<string, string[]> }>;
  const manifest = Object.values(all)[0];
  return Object.values(manifest?.entryJSFiles ?? {}).flat();
}

const build = readJson<{ rootMainFiles: string[] }>('build-manifest.json');
const rows: { page: string; kb: number; files: number }[] = [];
const total = (files: Iterable<string>) => {
  const unique = [...new Set([...files].filter((f) => f.endsWith('.js')))];
  return { kb: unique.reduce((sum, f) => sum + gzipSize(f), 0) / 1024, files: unique.length };
};

for (const [page, route] of Object.entries(APP_PAGES)) {
  rows.push({ page, ...total([...build.rootMainFiles, ...entryFiles(route)]) });
}
// The athlete's verdict page (Pages Router, unstable_runtimeJS: false) is measured from the
// scripts its served HTML names, by bench/verdict-page.ts.

if (process.argv.includes('--json')) {
  console.log(JSON.stringify(rows, null, 2));
} else {
  console.log(`First-load JavaScript, gzipped (build ${fs.readFileSync(path.join(NEXT, 'BUILD_ID'), 'utf8')})`);
  for (const row of rows) {
    console.log(`${row.page.padEnd(36)} ${row.kb.toFixed(1).padStart(7)} KB  (${row.files} files)`);
  }
  const workbench = rows.find((r) => r.page === '/reviews/[id]')!;
  console.log(
    `\nWorkbench goal ≤ ${GOAL_WORKBENCH_KB} KB: ${workbench.kb <= GOAL_WORKBENCH_KB ? 'met' : 'NOT met'} (${workbench.kb.toFixed(1)} KB)`,
  );
}

/**
 * Benchmark (not a test): Lighthouse (npm `lighthouse`, 12.x for Node 20) against the production
 * build, with Debian's chromium. Two pages, as people use them:
 *
 * - the workbench /reviews/<id>, signed in as the demo coach, desktop preset — goal: performance
 *   ≥ 90, accessibility 100;
 * - the athlete's verdict page /v/<slug>, signed out, mobile preset (Lighthouse's default) —
 *   goal: performance ≥ 95, accessibility 100.
 *
 *   npm run build && npx tsx bench/lighthouse.ts [--json] [--page=workbench|verdict] [--save=DIR] [--once]
 *
 * Uses the production build on a throwaway seeded SQLite file (bench/lib/production.ts). Each page is
 * run three times and the median performance score kept (Lighthouse's own advice: single runs
 * vary). Every failed audit of a category below 100 is listed, so a regression says what broke.
 * On a shared machine Total Blocking Time follows the load, so the report also gives the load
 * average, what moved (layout shifts and their elements) and where the main thread's time went —
 * figures that vary less from run to run. `--save=DIR` keeps every run's full report.
 */
import { execFileSync } from 'node:child_process';
import { createRequire } from 'node:module';
import { mkdirSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import path from 'node:path';
import * as chromeLauncher from 'chrome-launcher';
import type { Result } from 'lighthouse';
import { startProduction } from './lib/production';

const DEFAULT_RUNS = 3;
const LIGHTHOUSE_CLI = createRequire(import.meta.url).resolve('lighthouse/cli/index.js');
const CHROMIUM = '/usr/bin/chromium';
const COACH = { email: 'coach@granite-hollow.test', password: 'loadbearing-demo' };
const VERDICT_SLUG = 'cold-plunges-after-strength';

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

interface PageScore {
  page: string;
  preset: 'desktop' | 'mobile';
  performance: number;
  accessibility: number;
  runs: number[];
  failing: string[];
  metrics: Record<string, string>;
  /** Each run's CLS and TBT, in run order. */
  runMetrics: { cls: number; tbtMs: number }[];
  /** The median run's layout shifts: the element that moved and its share of the CLS. */
  shifts: string[];
  /** The median run's main-thread time by category, ms. */
  mainThread: Record<string, number>;
  /** The median run's long tasks: script and duration. */
  longTasks: string[];
  loadAverage: number[];
}

interface TableItem {
  [key: string]: unknown;
}
const tableItems = (lhr: Result, id: string): TableItem[] => {
  const details = lhr.audits[id]?.details as { items?: TableItem[] } | undefined;
  return details?.items ?? [];
};
const shortUrl = (url: unknown) => (typeof url === 'string' ? url.replace(/^https?:\/\/[^/]+/, '') : String(url));

const saveDir = process.argv.find((a) => a.startsWith('--save='))?.slice('--save='.length);
const onlyOnce = process.argv.includes('--once');
const onlyPage = process.argv.find((a) => a.startsWith('--page='))?.slice('--page='.length);

async function audit(
  port: number,
  url: string,
  preset: 'desktop' | 'mobile',
  cookie: string | undefined,
): Promise<PageScore> {
  const args = [
    LIGHTHOUSE_CLI,
    url,
    `--port=${port}`,
    '--output=json',
    '--output-path=stdout',
    '--quiet',
    '--only-categories=performance,accessibility',
    ...(preset === 'desktop' ? ['--preset=desktop'] : []),
    ...(cookie ? [`--extra-headers=${JSON.stringify({ Cookie: cookie })}`] : []),
  ];
  const RUNS = onlyOnce ? 1 : DEFAULT_RUNS;
  const results: Result[] = [];
  const loads: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    loads.push(loadavg()[0]);
    // The CLI in its own plain Node process: Lighthouse sends functions' source to the page, and
    // this script's TypeScript loader would have rewritten them with helpers the page lacks.
    // With --save, the first run also keeps its trace and other artifacts (Lighthouse's -GA), where
    // every LayoutShift event lists the moved nodes with their old and new rectangles.
    const gather =
      saveDir && i === 0
        ? [`-GA=${path.join(saveDir, `${new URL(url).pathname.replace(/\W+/g, '_')}-${preset}-artifacts`)}`]
        : [];
    const out = execFileSync(process.execPath, [...args, ...gather], { maxBuffer: 64 * 1024 * 1024, encoding: 'utf8' });
    const lhr = JSON.parse(out) as Result;
    if (lhr.runtimeError) throw new Error(`${url}: ${lhr.runtimeError.message}`);
    results.push(lhr);
    if (saveDir) {
      const name = `${new URL(url).pathname.replace(/\W+/g, '_')}-${preset}-${i + 1}.json`;
      writeFileSync(path.join(saveDir, name), out);
    }
  }
  const perf = results.map((r) => Math.round((r.categories.performance.score ?? 0) * 100));
  const lhr = results.find((r) => Math.round((r.categories.performance.score ?? 0) * 100) === median(perf))!;
  const failing: string[] = [];
  for (const category of Object.values(lhr.categories)) {
    for (const ref of category.auditRefs) {
      const a = lhr.audits[ref.id];
      if (ref.weight > 0 && a.score !== null && a.score < 1) {
        failing.push(`${category.id}: ${a.id} (${Math.round(a.score * 100)}) ${a.displayValue ?? ''}`.trim());
      }
    }
  }
  const metric = (id: string) => lhr.audits[id]?.displayValue ?? '—';
  const shifts = tableItems(lhr, 'layout-shifts').map((item) => {
    const node = item.node as { selector?: string; snippet?: string } | undefined;
    const what = node?.snippet ? node.snippet.slice(0, 120) : (node?.selector ?? 'unattributed');
    return `${Number(item.score).toFixed(3)} ${what}`;
  });
  const mainThread = Object.fromEntries(
    tableItems(lhr, 'mainthread-work-breakdown').map((item) => [
      String(item.groupLabel),
      Math.round(Number(item.duration)),
    ]),
  );
  const longTasks = tableItems(lhr, 'long-tasks').map(
    (item) =>
      `${Math.round(Number(item.duration))} ms at ${Math.round(Number(item.startTime))} ms ${shortUrl(item.url)}`,
  );
  return {
    page: new URL(url).pathname,
    preset,
    performance: median(perf),
    accessibility: Math.round((lhr.categories.accessibility.score ?? 0) * 100),
    runs: perf,
    failing,
    metrics: {
      FCP: metric('first-contentful-paint'),
      LCP: metric('largest-contentful-paint'),
      TBT: metric('total-blocking-time'),
      CLS: metric('cumulative-layout-shift'),
    },
    runMetrics: results.map((r) => ({
      cls: Number((r.audits['cumulative-layout-shift']?.numericValue ?? 0).toFixed(3)),
      tbtMs: Math.round(r.audits['total-blocking-time']?.numericValue ?? 0),
    })),
    shifts,
    mainThread,
    longTasks,
    loadAverage: loads.map((l) => Number(l.toFixed(2))),
  };
}

async function main() {
  const app = await startProduction({ name: 'bench-lh' });
  const base = app.url;
  const reviewId = app.firstReviewId;
  const chrome = await chromeLauncher.launch({
    chromePath: CHROMIUM,
    chromeFlags: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'],
  });
  try {
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: base },
      body: JSON.stringify(COACH),
    });
    if (signIn.status !== 200) throw new Error(`Signing in answered ${signIn.status}`);
    const cookie = signIn.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    // Warm the server's caches and compile paths once, so the first measured run is not an outlier.
    await fetch(`${base}/reviews/${reviewId}`, { headers: { cookie } });
    await fetch(`${base}/v/${VERDICT_SLUG}`);

    if (saveDir) mkdirSync(saveDir, { recursive: true });
    const scores: PageScore[] = [];
    if (onlyPage !== 'verdict') scores.push(await audit(chrome.port, `${base}/reviews/${reviewId}`, 'desktop', cookie));
    if (onlyPage !== 'workbench')
      scores.push(await audit(chrome.port, `${base}/v/${VERDICT_SLUG}`, 'mobile', undefined));
    if (process.argv.includes('--json')) {
      console.log(JSON.stringify(scores, null, 2));
      return;
    }
    for (const s of scores) {
      const goal = s.preset === 'desktop' ? 90 : 95;
      console.log(
        `${s.page} (${s.preset}): performance ${s.performance} (runs ${s.runs.join(', ')}; goal ≥ ${goal}), ` +
          `accessibility ${s.accessibility} (goal 100)`,
      );
      console.log(
        `  ${Object.entries(s.metrics)
          .map(([k, v]) => `${k} ${v}`)
          .join(' · ')}`,
      );
      console.log(
        `  runs: ${s.runMetrics.map((m) => `CLS ${m.cls} TBT ${m.tbtMs} ms`).join(' | ')}; ` +
          `load average (1 min) at each run's start: ${s.loadAverage.join(', ')}`,
      );
      console.log(
        `  main thread (median run): ${Object.entries(s.mainThread)
          .map(([k, v]) => `${k} ${v} ms`)
          .join(' · ')}`,
      );
      for (const t of s.longTasks) console.log(`  long task — ${t}`);
      for (const shift of s.shifts) console.log(`  layout shift — ${shift}`);
      for (const f of s.failing) console.log(`  below 100 — ${f}`);
    }
  } finally {
    await chrome.kill();
    await app.stop();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

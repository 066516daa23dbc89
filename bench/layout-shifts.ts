/**
 * Benchmark (not a test): what moves while the workbench loads, element by element. Lighthouse
 * gives one CLS figure and the element it blames most; this names every shifted element with its
 * rectangle before and after and when it moved, on the desktop preset's window (1350×940) and a
 * phone's (390×844), so a shift can be traced to the component that caused it. Layout shifts do
 * not depend on the machine's load the way blocking time does.
 *
 *   npm run build && npx tsx bench/layout-shifts.ts [--json] [--screenshots=DIR]
 *
 * A throwaway seeded SQLite file and `npm start`'s server (scripts/start.ts), signed in as the demo
 * coach, like bench/lighthouse.ts. Shifts are read with the Layout Instability API
 * (https://wicg.github.io/layout-instability/) until the page has been quiet for 3 s.
 */
import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import { chromium } from 'playwright-core';

const COACH = { email: 'coach@granite-hollow.test', password: 'loadbearing-demo' };
const VIEWPORTS = [
  { name: 'desktop', width: 1350, height: 940 },
  { name: 'phone', width: 390, height: 844 },
] as const;

interface Shift {
  at: number;
  value: number;
  recentInput: boolean;
  sources: { node: string; before: string; after: string }[];
}

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
  const screenshots = process.argv.find((a) => a.startsWith('--screenshots='))?.slice('--screenshots='.length);
  const work = mkdtempSync(path.join(tmpdir(), 'loadbearing-bench-cls-'));
  const databaseFile = path.join(work, 'bench.sqlite');
  process.env.DATABASE_URL = databaseFile;
  process.env.ALLOW_DEMO_SEED = '1';
  const { db } = await import('../lib/db');
  const { migrate, seed } = await import('../db/migrate');
  await migrate(db());
  await seed(db());
  const [rows] = await db().query('SELECT id FROM reviews ORDER BY id LIMIT 1');
  const reviewId = (rows as { id: number }[])[0]?.id ?? 1;
  await db().close();

  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
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
      COOKIE_SECURE: 'false',
      APP_URL: base,
      SMTP_PORT: '1',
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'],
  });
  try {
    for (let i = 0; i < 480; i++) {
      try {
        if ((await fetch(`${base}/`)).status < 500) break;
      } catch {
        // not up yet
      }
      await new Promise((r) => setTimeout(r, 250));
    }
    const report: Record<string, { cls: number; shifts: Shift[]; loadAverage: number }> = {};
    for (const viewport of VIEWPORTS) {
      const context = await browser.newContext({ baseURL: base, viewport });
      const signIn = await context.request.post('/api/auth/sign-in', { data: COACH, headers: { origin: base } });
      if (signIn.status() !== 200) throw new Error(`Signing in answered ${signIn.status()}`);
      const page = await context.newPage();
      // Registered before any of the page's scripts: every shift from the first paint on.
      await page.addInitScript(() => {
        const w = window as unknown as { __shifts: unknown[] };
        w.__shifts = [];
        const describe = (node: Node | null) => {
          if (!node || !(node instanceof Element)) return node ? node.nodeName : 'unattributed';
          const id = node.id ? `#${node.id}` : '';
          const testId = node.getAttribute('data-testid');
          const cls = (node.getAttribute('class') ?? '').split(/\s+/).slice(0, 4).join('.');
          const text = (node.textContent ?? '').trim().replace(/\s+/g, ' ').slice(0, 50);
          return `<${node.tagName.toLowerCase()}${id}${testId ? ` [${testId}]` : ''}${cls ? ` .${cls}` : ''}> “${text}”`;
        };
        const rect = (r: DOMRectReadOnly) =>
          `${Math.round(r.x)},${Math.round(r.y)} ${Math.round(r.width)}×${Math.round(r.height)}`;
        new PerformanceObserver((list) => {
          for (const entry of list.getEntries() as unknown as {
            startTime: number;
            value: number;
            hadRecentInput: boolean;
            sources: { node: Node | null; previousRect: DOMRectReadOnly; currentRect: DOMRectReadOnly }[];
          }[]) {
            w.__shifts.push({
              at: Math.round(entry.startTime),
              value: Number(entry.value.toFixed(4)),
              recentInput: entry.hadRecentInput,
              sources: entry.sources.map((s) => ({
                node: describe(s.node),
                before: rect(s.previousRect),
                after: rect(s.currentRect),
              })),
            });
          }
        }).observe({ type: 'layout-shift', buffered: true });
      });
      const load = loadavg()[0];
      // The demo coach's first review is frozen by an open round, so there is no editor to wait
      // for: the page is done when the network has been idle and then nothing happened for 3 s.
      await page.goto(`/reviews/${reviewId}`, { waitUntil: 'networkidle', timeout: 120_000 });
      await page.waitForTimeout(3000);
      const shifts = (await page.evaluate(() => (window as unknown as { __shifts: Shift[] }).__shifts)) ?? [];
      if (screenshots) {
        mkdirSync(screenshots, { recursive: true });
        await page.screenshot({ path: path.join(screenshots, `workbench-${viewport.name}.png`) });
      }
      report[viewport.name] = {
        cls: Number(
          shifts
            .filter((s) => !s.recentInput)
            .reduce((sum, s) => sum + s.value, 0)
            .toFixed(4),
        ),
        shifts,
        loadAverage: Number(load.toFixed(2)),
      };
      await context.close();
    }
    if (process.argv.includes('--json')) {
      console.log(JSON.stringify(report, null, 2));
      return;
    }
    for (const [name, r] of Object.entries(report)) {
      console.log(`/reviews/${reviewId} ${name}: sum of shifts ${r.cls} (load average ${r.loadAverage})`);
      for (const s of r.shifts) {
        console.log(`  ${s.value} at ${s.at} ms${s.recentInput ? ' (after input)' : ''}`);
        for (const src of s.sources) console.log(`    ${src.node}: ${src.before} → ${src.after}`);
      }
    }
  } finally {
    await browser.close();
    server.kill('SIGTERM');
    rmSync(work, { recursive: true, force: true });
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

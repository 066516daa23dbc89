/**
 * Benchmark (not a test): what moves while the workbench loads, element by element. Lighthouse
 * gives one CLS figure and the element it blames most; this names every shifted element with its
 * rectangle before and after and when it moved, on the desktop preset's window (1350×940) and a
 * phone's (390×844), so a shift can be traced to the component that caused it. Layout shifts do
 * not depend on the machine's load the way blocking time does.
 *
 *   npm run build && npx tsx bench/layout-shifts.ts [--json] [--screenshots=DIR]
 *
 * The production build on a throwaway seeded SQLite file (bench/lib/production.ts), signed in as the demo
 * coach, like bench/lighthouse.ts. Shifts are read with the Layout Instability API
 * (https://wicg.github.io/layout-instability/) until the page has been quiet for 3 s.
 */
import { mkdirSync } from 'node:fs';
import { loadavg } from 'node:os';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { startProduction } from './lib/production';

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

async function main() {
  const screenshots = process.argv.find((a) => a.startsWith('--screenshots='))?.slice('--screenshots='.length);
  const app = await startProduction({ name: 'bench-cls' });
  const base = app.url;
  const reviewId = app.firstReviewId;
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'],
  });
  try {
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
    await app.stop();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});

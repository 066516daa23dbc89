import { describe, expect, it } from 'vitest';
import { signInWithForm, useBrowser } from './browser';

// What a verdict hangs on (docs/scoring.md §9): the coach's "How solid is this?" beside the
// workbench, and the athlete's plain words on the published page (no JavaScript there).

const browser = useBrowser();
const PHONE = { width: 390, height: 844 };
const CLAIM_TITLE = 'Cold plunges after strength sessions';

describe('how solid a verdict is', () => {
  it('the coach reads what the verdict hangs on, reaches every dot of the chart with the keyboard, and has the chart as a table', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInWithForm(page, 'coach2@granite-hollow.test');
    const { reviews } = await (await page.request.get('/api/reviews')).json();
    const review = reviews.find((r: { title: string }) => r.title === CLAIM_TITLE);
    const verdict = await (await page.request.get(`/api/reviews/${review.id}/verdict`)).json();

    await page.goto(`/reviews/${review.id}`);
    const panel = page.getByTestId('robustness');
    await panel.waitFor();
    expect(await panel.getByRole('heading', { name: 'How solid is this?' }).isVisible()).toBe(true);
    const sentence = await panel.getByTestId('robustness-sentence').innerText();
    expect(sentence).toContain(verdict.label);
    for (const row of verdict.robustness.leaveOneOut.filter((r: { changed: boolean }) => r.changed)) {
      expect(sentence).toContain(row.citation);
    }

    // One focusable row per study plus "All studies", each reading out its numbers.
    const rows = panel.locator('[data-testid=leave-one-out-chart] svg g[tabindex="0"]');
    expect(await rows.count()).toBe(verdict.robustness.leaveOneOut.length + 1);
    await rows.first().focus();
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toMatch(
      /^All studies: \d+ %/,
    );
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toMatch(
      new RegExp(`^Without ${verdict.robustness.leaveOneOut[0].citation.replace(/[()]/g, '\\$&')}: \\d+ %`),
    );

    // The text alternative: the same rows as a table.
    await panel.getByText('The chart as a table').click();
    const table = panel.getByRole('table');
    expect(await table.locator('tbody tr').count()).toBe(verdict.robustness.leaveOneOut.length + 1);
    await context.close();
  });

  it('fits a phone, and the athlete reads in plain words what the published verdict rests on', async () => {
    const context = await browser.newContext({ viewport: PHONE });
    const page = await context.newPage();
    await signInWithForm(page, 'coach2@granite-hollow.test');
    const { reviews } = await (await page.request.get('/api/reviews')).json();
    const review = reviews.find((r: { title: string }) => r.title === CLAIM_TITLE);
    await page.goto(`/reviews/${review.id}`);
    const chart = page.getByTestId('leave-one-out-chart');
    await chart.waitFor();
    const box = (await chart.locator('svg').boundingBox())!;
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(PHONE.width);
    await context.close();

    // Signed out, on a phone: the public page of the same review.
    const reader = await browser.newContext({ viewport: PHONE });
    const athlete = await reader.newPage();
    const { verdicts } = await (await athlete.request.get('/api/verdicts')).json();
    const published = verdicts.find((v: { title: string }) => v.title === CLAIM_TITLE);
    const response = await athlete.goto(`/v/${published.slug}`);
    expect(response?.status()).toBe(200);
    const section = athlete.getByRole('region', { name: 'How firm is this verdict?' });
    const words = await section.innerText();
    expect(words).toMatch(/This verdict rests on /);
    expect(words).toMatch(/It would (change if|take several studies)/);
    // Still a page without client script.
    expect(await athlete.locator('script[src]').count()).toBe(0);
    await reader.close();
  });
});

import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { markApproved } from './approve';
import { useBrowser } from './browser';

/**
 * What a coach enters is what every screen shows, and each role finds only doors it can open:
 * an appraisal with several different certainty domains gives the same certainty in the table,
 * the verdict panel and the published page; a long claim's public address ends on a whole word;
 * the signed-out header fits a 390 px phone; an athlete's navigation offers only what they can
 * open. Uses the owner and the first demo athlete (other journeys use other accounts).
 */

const browser = useBrowser();
const stamp = Date.now().toString(36);
const PHONE = { width: 390, height: 844 };

async function signedIn(email: string, viewport?: { width: number; height: number }) {
  const context: BrowserContext = await browser.newContext({ viewport });
  const res = await context.request.post('/api/auth/sign-in', { data: { email, password: 'loadbearing-demo' } });
  expect(res.status()).toBe(200);
  const page: Page = await context.newPage();
  page.setDefaultTimeout(60_000);
  return { context, page };
}

const protocol = {
  exercise: 'Half-crimp hang on a 20 mm edge',
  loadValue: 10,
  loadUnit: 'kg-added',
  referenceBodyweightKg: 70,
  referenceMaxAddedKg: 30,
  secondsPerSet: 10,
  setsPerSession: 5,
  sessionsPerDay: 1,
  daysPerWeek: 3,
  minHoursBetween: null,
  weeks: 6,
  effort: 'hard',
};

describe('what a coach enters is what every screen shows', () => {
  it('five certainty domains set apart give one certainty in the table, the verdict panel and the published page', async () => {
    const { context, page } = await signedIn('owner@granite-hollow.test');
    const me = await (await context.request.get('/api/me')).json();
    const teamId = me.teams.find((t: { slug: string }) => t.slug === 'granite-hollow').id;
    const claim = `Six weeks of weighted edge hangs make half-crimp fingers stronger for every recreational boulderer ${stamp}`;
    const created = await context.request.post('/api/reviews', {
      data: {
        teamId,
        claim,
        claimSource: 'A forum post',
        protocol,
        population: { status: 'recreational', injured: false },
      },
    });
    expect(created.status()).toBe(201);
    const reviewId = (await created.json()).review.id as number;
    // Same population and intensity (0.8) as the protocol: applicability 1.
    const study = await context.request.post('/api/studies', {
      data: {
        teamId,
        title: `Weighted hangs in recreational boulderers ${stamp}`,
        year: 2025,
        design: 'randomized',
        population: 'recreational',
        intensity: 0.8,
      },
    });
    expect(study.status()).toBe(201);

    await page.goto(`/reviews/${reviewId}`);
    await page.getByTestId('verdict-label').waitFor();
    await page.getByRole('button', { name: 'Appraise a study for the outcome' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('combobox', { name: /study/i }).fill(stamp);
    await dialog.getByRole('option').first().waitFor();
    await dialog.getByRole('combobox', { name: /study/i }).press('Enter');
    await dialog.locator('input[name=direction][value=supports]').check();
    // Randomized starts at 4: −1 risk of bias, −2 indirectness → 1 = very low; publication bias
    // left at "none". Read all from the publication-bias column, it would be high.
    await dialog.locator('select[name=riskOfBias]').selectOption('serious');
    await dialog.locator('select[name=inconsistency]').selectOption('none');
    await dialog.locator('select[name=indirectness]').selectOption('very-serious');
    await dialog.locator('select[name=imprecision]').selectOption('none');
    await dialog.locator('select[name=publicationBias]').selectOption('none');
    await dialog.getByRole('button', { name: 'Save appraisal' }).click();
    await dialog.waitFor({ state: 'hidden' });

    // The table, after a reload (what was stored, not what the form still holds).
    await page.reload();
    const row = page.getByTestId('appraisal-certainty').first();
    await expect.poll(() => row.getAttribute('data-certainty')).toBe('very-low');
    // The verdict panel: evidence weight = w(very low) 0.1 × applicability 1 (docs/scoring.md §4).
    await expect.poll(() => page.getByTestId('evidence-weight').textContent()).toBe('0.1');
    expect(await page.getByTestId('verdict-label').getAttribute('data-verdict')).toBe('insufficient');

    // The published page carries the same verdict.
    await markApproved(reviewId);
    const published = await context.request.post(`/api/reviews/${reviewId}/publish`, {
      data: { visibility: 'public' },
    });
    expect(published.status()).toBe(201);
    const slug = (await published.json()).slug as string;
    const reader = await (await browser.newContext({ viewport: PHONE })).newPage();
    await reader.goto(`/v/${slug}`);
    expect(await reader.locator('h1').textContent()).toContain(claim.slice(0, 40));
    expect(await reader.locator('[data-verdict-chip]').first().getAttribute('data-verdict-chip')).toBe('insufficient');

    // The public address ends on a whole word of the claim, not inside one.
    const words = claim.toLowerCase().split(/\s+/);
    expect(words).toContain(slug.replace(/-\d+$/, '').split('-').pop());
    await context.close();
  });
});

describe('each role finds only doors it can open', () => {
  it('the signed-out header fits a 390 px phone, and public verdicts can be listed and searched', async () => {
    const context = await browser.newContext({ viewport: PHONE });
    const page = await context.newPage();
    await page.goto('/');
    expect(await page.evaluate(() => document.querySelector('header')!.scrollWidth)).toBeLessThanOrEqual(390);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.locator('header').getByRole('link', { name: 'Verdicts' }).click();
    await page.waitForURL('**/published');
    expect(await page.locator('[data-verdict-chip]').count()).toBeGreaterThan(0);
    await page.getByRole('searchbox').fill('plunge');
    await expect.poll(() => page.getByText(/verdicts? found/).textContent()).toMatch(/^[1-9]\d* verdicts? found/);
    await context.close();
  });

  it('an athlete’s navigation offers only what an athlete can open, and the dashboard shows the latest verdicts', async () => {
    const { context, page } = await signedIn('athlete@granite-hollow.test', PHONE);
    await page.goto('/dashboard');
    const labels = await page.locator('nav[aria-label=Main]').last().getByRole('link').allTextContents();
    expect(labels).toEqual(['Dashboard', 'Verdicts', 'Team']);
    await page.getByTestId('latest-verdicts').getByRole('link').nth(1).waitFor();
    await context.close();
  });
});

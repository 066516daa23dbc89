import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { useBrowser } from './browser';

const browser = useBrowser();
const stamp = Date.now().toString(36);

async function signedIn(email: string): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext();
  await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: browser.baseURL });
  const res = await context.request.post('/api/auth/sign-in', { data: { email, password: 'loadbearing-demo' } });
  expect(res.status()).toBe(200);
  const page = await context.newPage();
  page.setDefaultTimeout(30_000);
  return { context, page };
}

let reviewPath = '';

describe('a coach takes a claim apart in the workbench', () => {
  it('captures the claim, adds two mechanisms, imports two studies, appraises them and watches the verdict change', async () => {
    const { context, page } = await signedIn('coach@granite-hollow.test');
    await page.goto('/reviews/new');
    await page
      .locator('textarea[name=claim]')
      .fill(`Short daily edge hangs at 40 % make crimps stronger in three weeks (${stamp})`);
    await page.locator('input[name=claimSource]').fill('A short video shared in a climbing group');
    await page.locator('input[name="protocol.exercise"]').fill('Half-crimp hang on a 20 mm edge');
    await page.locator('input[name="protocol.loadValue"]').fill('40');
    await page.locator('select[name="protocol.loadUnit"]').selectOption('percent-max');
    await page.locator('input[name="protocol.secondsPerSet"]').fill('10');
    await page.locator('input[name="protocol.setsPerSession"]').fill('4');
    await page.locator('input[name="protocol.sessionsPerDay"]').fill('2');
    await page.locator('input[name="protocol.minHoursBetween"]').fill('6');
    await page.locator('input[name="protocol.weeks"]').fill('3');
    await page.locator('select[name="protocol.effort"]').selectOption('easy');
    await page.locator('select[name="population.status"]').selectOption('recreational');
    // The form converts the load to the one 0…1 scale the model uses and shows it.
    expect(await page.getByTestId('intensity-preview').textContent()).toMatch(/40\s?%/);
    await page.getByRole('button', { name: 'Create review' }).click();
    await page.waitForURL(/\/reviews\/\d+$/, { timeout: 60_000 });
    reviewPath = new URL(page.url()).pathname;
    await page.getByTestId('verdict-label').waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('verdict-label').textContent()).toMatch(/Not enough evidence/);

    await page.locator('.ProseMirror').click();
    await page.keyboard.type('The claim rests on tendon adaptation; the dose looks light for that.');
    await page.keyboard.press('Enter');
    for (const m of [
      { name: 'Tendon stiffening', kind: 'physiological', minIntensity: '70', minEffort: 'hard', stated: true },
      { name: 'Grip skill on small edges', kind: 'skill' },
    ]) {
      await page.getByRole('button', { name: 'Add mechanism' }).click();
      const dialog = page.getByRole('dialog');
      await dialog.locator('input[name=name]').fill(m.name);
      await dialog.locator('select[name=kind]').selectOption(m.kind);
      if (m.minIntensity) await dialog.locator('input[name=minIntensity]').fill(m.minIntensity);
      if (m.minEffort) await dialog.locator('select[name=minEffort]').selectOption(m.minEffort);
      if (m.stated) await dialog.locator('input[name=stated]').check();
      await dialog.getByRole('button', { name: 'Save mechanism' }).click();
      await dialog.waitFor({ state: 'hidden' });
      await page.locator('[data-testid=mechanism-block]', { hasText: m.name }).waitFor();
    }
    expect(await page.getByTestId('mechanism-block').count()).toBe(2);
    await page
      .getByTestId('save-status')
      .filter({ hasText: /^Saved/ })
      .waitFor();

    // Two studies by pasting BibTeX into the library, then their design and effect data.
    const lib = await context.newPage();
    await lib.goto('/library');
    await lib.locator('textarea[name=source]').fill(`@article{vale${stamp},
  author = {Vale, Jonah and Lindqvist, Sofie},
  title = {Low-load edge hangs and finger flexor strength ${stamp}},
  journal = {Journal of Invented Climbing Science}, year = {2024}, volume = {3}, pages = {11--19},
  doi = {10.5555/e2e.${stamp}.1}
}
@article{castellan${stamp},
  author = {Castellan, Priya and Okafor, Ilse and Holt, Maren},
  title = {Heavy isometric hangs stiffen finger flexor tendons ${stamp}},
  journal = {Journal of Invented Climbing Science}, year = {2023}, volume = {2}, pages = {40--52},
  doi = {10.5555/e2e.${stamp}.2}
}`);
    await lib.getByRole('button', { name: 'Add studies' }).click();
    await lib.getByTestId('import-results').waitFor({ timeout: 60_000 });
    expect(await lib.getByTestId('import-result').count()).toBe(2);
    expect(await lib.getByTestId('import-results').textContent()).toMatch(/added/i);
    const links = lib.getByTestId('import-result').locator('a');
    const hrefs = [await links.nth(0).getAttribute('href'), await links.nth(1).getAttribute('href')];
    const details = [
      { population: 'recreational', intensity: '40', m: ['52', '8', '12', '50', '8', '12'] },
      { population: 'trained', intensity: '85', m: ['60', '9', '15', '52', '9', '15'] },
    ];
    for (const [i, href] of hrefs.entries()) {
      await lib.goto(href!);
      await lib.getByRole('button', { name: 'Edit details' }).click();
      await lib.locator('select[name=design]').selectOption('randomized');
      await lib.locator('select[name=population]').selectOption(details[i].population);
      await lib.locator('input[name=intensity]').fill(details[i].intensity);
      await lib.locator('input[name=n]').fill('24');
      await lib.locator('select[name="effect.kind"]').selectOption('means');
      for (const [j, key] of ['m1', 'sd1', 'n1', 'm2', 'sd2', 'n2'].entries()) {
        await lib.locator(`input[name="effect.${key}"]`).fill(details[i].m[j]);
      }
      await lib.getByRole('button', { name: 'Save study details' }).click();
      await lib.getByRole('button', { name: 'Edit details' }).waitFor();
    }
    await lib.close();

    await page.reload();
    await page.getByTestId('verdict-label').waitFor({ timeout: 60_000 });
    const appraise = async (
      button: () => ReturnType<Page['getByRole']>,
      query: string,
      domains: Record<string, string> = {},
    ) => {
      await button().click();
      const dialog = page.getByRole('dialog');
      await dialog.getByRole('combobox', { name: /study/i }).fill(query);
      await dialog.getByRole('option').first().waitFor();
      await dialog.getByRole('combobox', { name: /study/i }).press('Enter');
      await dialog.locator('input[name=direction][value=supports]').check();
      // A direction the study's effect does not suggest asks for a reason (docs/scoring.md §10).
      const reason = dialog.locator('textarea[name=directionReason]');
      if (await reason.count()) await reason.fill('A small trial; the direction matches the larger one.');
      const before = await dialog.getByTestId('certainty-level').textContent();
      for (const [k, v] of Object.entries(domains)) await dialog.locator(`select[name=${k}]`).selectOption(v);
      // Certainty is recomputed live as the domains change.
      if (Object.keys(domains).length)
        expect(await dialog.getByTestId('certainty-level').textContent()).not.toBe(before);
      await dialog.getByRole('button', { name: 'Save appraisal' }).click();
      await dialog.waitFor({ state: 'hidden' });
    };
    const card = (name: string) => page.getByTestId('mechanism-card').filter({ hasText: name });
    await appraise(() => card('Grip skill on small edges').getByRole('button', { name: 'Appraise a study' }), 'Vale');
    await appraise(() => card('Tendon stiffening').getByRole('button', { name: 'Appraise a study' }), 'Castellan', {
      imprecision: 'serious',
    });
    await appraise(() => page.getByRole('button', { name: 'Appraise a study for the outcome' }), 'Vale');
    await appraise(() => page.getByRole('button', { name: 'Appraise a study for the outcome' }), 'Castellan');
    await expect
      .poll(() => page.getByTestId('verdict-label').textContent(), { timeout: 30_000 })
      .not.toMatch(/Not enough evidence/);
    expect(await page.getByTestId('outcome-probability').textContent()).toMatch(/\d+\s?%/);
    // The working behind the numbers opens up.
    await page.locator('[data-testid=verdict-working] summary').click();
    expect(await page.getByTestId('verdict-working').textContent()).toMatch(/ln|log|odds/i);
    mkdirSync('tests/e2e/artifacts', { recursive: true });
    await page.screenshot({ path: path.join('tests/e2e/artifacts', 'workbench-1280.png'), fullPage: true });
    await context.close();
  });

  it('draws its first view at the final size: hydrating and creating the editor move nothing', async () => {
    expect(reviewPath).not.toBe('');
    // Where the page's landmarks are in the server's HTML alone (the app's scripts are not
    // loaded; only the inline ones that put streamed parts in place run), and where they are
    // once the page is hydrated, the editor created and the verdict shown: the same places.
    const where = async (page: Page) => {
      const box = async (selector: string) => {
        // React reveals a streamed part a moment after it arrives (react-dom's inline `$RC`
        // script batches reveals on requestAnimationFrame or a ~300 ms timer), so a part can
        // still be hidden when the load event fires: wait until it shows (it failed once so).
        await page.locator(selector).first().waitFor();
        const b = await page.locator(selector).first().boundingBox();
        return b && { y: Math.round(b.y), height: Math.round(b.height) };
      };
      return {
        text: await box('#review-body-title'),
        firstBlock: await box('[data-testid=mechanism-block]'),
        mechanisms: await box('#mechanisms-title'),
        firstCard: await box('[data-testid=mechanism-card]'),
        outcome: await box('#outcome-title'),
        verdict: await box('[data-testid=verdict-panel]'),
      };
    };
    const measure = async (hydrate: boolean) => {
      const context = await browser.newContext();
      if (!hydrate) await context.route('**/_next/static/**/*.js', (route) => route.abort());
      const res = await context.request.post('/api/auth/sign-in', {
        data: { email: 'coach@granite-hollow.test', password: 'loadbearing-demo' },
      });
      expect(res.status()).toBe(200);
      const page = await context.newPage();
      page.setDefaultTimeout(30_000);
      await page.goto(reviewPath);
      if (hydrate) {
        await page.waitForSelector('.ProseMirror [data-testid=mechanism-block]', { timeout: 60_000 });
        await page.getByRole('button', { name: 'Bold', exact: true, disabled: false }).waitFor();
      } else {
        // The server's HTML already has the verdict and each block's probability.
        expect(await page.getByTestId('verdict-label').count()).toBe(1);
        expect(await page.getByTestId('mechanism-block-probability').first().textContent()).toMatch(/\d+\s?%/);
        expect(await page.locator('.ProseMirror').count()).toBe(0);
      }
      await page.evaluate(() => document.fonts.ready.then(() => undefined)).catch(() => undefined);
      const found = await where(page);
      await context.close();
      return found;
    };
    const serverOnly = await measure(false);
    const hydrated = await measure(true);
    for (const [landmark, value] of Object.entries(serverOnly)) expect(value, landmark).not.toBeNull();
    expect(hydrated).toEqual(serverOnly);
  });

  it('uploads a PDF to a study: a fake PDF is 415, an oversize file 413, a real one downloads', async () => {
    const { context, page } = await signedIn('coach@granite-hollow.test');
    const list = await page.request.get('/api/studies?pageSize=1');
    const studyId = (await list.json()).studies[0].id;
    await page.goto(`/library/${studyId}`);
    await page.getByTestId('apa-reference').waitFor({ timeout: 60_000 });
    const input = page.locator('input[type=file][name=file]');
    await input.setInputFiles(path.resolve('fixtures/files/not-a-pdf.pdf'));
    await expect.poll(() => page.getByTestId('upload-error').textContent()).toMatch(/PDF/);
    await input.setInputFiles({
      name: 'huge.pdf',
      mimeType: 'application/pdf',
      buffer: Buffer.concat([Buffer.from('%PDF-1.4\n'), Buffer.alloc(21 * 1024 * 1024)]),
    });
    await expect.poll(() => page.getByTestId('upload-error').textContent(), { timeout: 30_000 }).toMatch(/larger than/);
    await input.setInputFiles(path.resolve('fixtures/files/tiny.pdf'));
    await page.getByTestId('pdf-download').waitFor();
    const file = await page.request.get((await page.getByTestId('pdf-download').getAttribute('href'))!);
    expect(file.status()).toBe(200);
    expect((await file.body()).subarray(0, 5).toString()).toBe('%PDF-');
    await context.close();
  });

  it('opens a forest plot on a seeded review', async () => {
    const { context, page } = await signedIn('owner@granite-hollow.test');
    const { reviews } = await (await page.request.get('/api/reviews')).json();
    const ladder = reviews.find((r: { title: string }) => /pull-up ladder/i.test(r.title));
    await page.goto(`/reviews/${ladder.id}`);
    await page.getByTestId('forest-plot').first().waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('forest-row').count()).toBeGreaterThanOrEqual(2);
    expect(await page.getByTestId('forest-pooled').count()).toBeGreaterThanOrEqual(1);
    await context.close();
  });

  it('two people edit the same review: the second save shows the conflict and keeps the typed text', async () => {
    expect(reviewPath).not.toBe('');
    const a = await signedIn('coach@granite-hollow.test');
    const b = await signedIn('owner@granite-hollow.test');
    for (const { page } of [a, b]) {
      await page.goto(reviewPath);
      await page.waitForSelector('.ProseMirror', { timeout: 60_000 });
    }
    await a.page.locator('.ProseMirror p').first().click();
    await a.page.keyboard.press('End');
    await a.page.keyboard.type(' The coach adds a sentence.');
    await a.page
      .getByTestId('save-status')
      .filter({ hasText: /^Saved ·/ })
      .waitFor();

    await b.page.locator('.ProseMirror p').first().click();
    await b.page.keyboard.press('End');
    await b.page.keyboard.type(' The owner writes something that must not be lost.');
    await b.page.getByTestId('conflict-banner').waitFor();
    await b.page.getByRole('button', { name: 'Keep mine as a copy' }).click();
    await b.page.getByTestId('kept-copy').waitFor();
    expect(await b.page.getByTestId('kept-copy').innerText()).toContain('must not be lost');
    // Their version is now in the editor, and the server still has the coach's sentence.
    expect(await b.page.locator('.ProseMirror').innerText()).toContain('The coach adds a sentence.');
    await a.context.close();
    await b.context.close();
  });
});

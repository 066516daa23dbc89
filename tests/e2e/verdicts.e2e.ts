import axe from 'axe-core';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { markApproved } from './approve';
import { linkFrom, signInWithForm, useBrowser, waitForMail } from './browser';

const browser = useBrowser();
// Unique to this file: no other journey signs in as the second demo athlete.
const ATHLETE = 'athlete2@granite-hollow.test';
const PHONE = { width: 375, height: 812 };

async function seriousAxeViolations(page: Page) {
  // Evaluated, not added as a <script>: the verdict page's policy lets no script tag run.
  await page.evaluate(axe.source);
  const result = (await page.evaluate(() =>
    (window as unknown as { axe: typeof axe }).axe.run(document, { resultTypes: ['violations'] }),
  )) as axe.AxeResults;
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

describe('publishing a verdict to a following athlete', () => {
  it('the owner publishes an approved review; the following athlete gets the mail, reads it on a phone, and finds it again by a misspelled word', async () => {
    // The athlete follows the team from their verdicts page.
    const athleteContext = await browser.newContext({ viewport: PHONE });
    const athlete = await athleteContext.newPage();
    await signInWithForm(athlete, ATHLETE);
    await athlete.goto('/verdicts');
    // Every section of the app's navigation fits the phone's row: none hides off-screen.
    const nav = athlete.getByRole('navigation', { name: 'Main' }).locator('ul').last();
    expect(await nav.evaluate((ul) => ul.scrollWidth - ul.clientWidth)).toBeLessThanOrEqual(0);
    await athlete.getByRole('button', { name: /Follow Granite Hollow Training Lab/ }).click();
    await expect.poll(() => athlete.getByText(/You will get an e-mail when Granite Hollow/).isVisible()).toBe(true);

    // The owner writes a review, it is approved, and the owner publishes it for the team.
    const ownerContext = await browser.newContext();
    const owner = await ownerContext.newPage();
    await signInWithForm(owner, 'owner@granite-hollow.test');
    const me = await (await owner.request.get('/api/me')).json();
    const teamId = me.teams.find((t: { slug: string }) => t.slug === 'granite-hollow').id;
    const claim = 'Sauna sessions after bouldering thicken finger pulleys within a month.';
    const created = await owner.request.post('/api/reviews', {
      data: {
        teamId,
        claim,
        claimSource: 'A post on a training forum',
        protocol: {
          exercise: 'Max hang on a 20 mm edge',
          loadValue: 10,
          loadUnit: 'kg-added',
          referenceBodyweightKg: 70,
          referenceMaxAddedKg: 30,
          secondsPerSet: 10,
          setsPerSession: 5,
          sessionsPerDay: 1,
          daysPerWeek: 3,
          minHoursBetween: null,
          weeks: 4,
          effort: 'hard',
        },
        population: { status: 'recreational', injured: false },
        tags: ['fingers', 'sauna'],
      },
    });
    expect(created.status()).toBe(201);
    const reviewId = (await created.json()).review.id as number;
    const mech = await owner.request.post(`/api/reviews/${reviewId}/mechanisms`, {
      data: {
        name: 'Connective-tissue remodelling',
        kind: 'physiological',
        summary: 'Heat said to speed up collagen turnover.',
        stated: true,
        prior: 0.2,
      },
    });
    expect(mech.status()).toBe(201);
    await markApproved(reviewId);
    const published = await owner.request.post(`/api/reviews/${reviewId}/publish`, { data: { visibility: 'team' } });
    expect(published.status()).toBe(201);
    const slug = (await published.json()).slug as string;

    // The mail reaches the fake; its link opens the verdict on the athlete's phone.
    const mail = await waitForMail((m) => m.to.includes(ATHLETE) && m.subject.includes('Sauna sessions'));
    expect(mail.text).toMatch(/Stop on pain/);
    expect(linkFrom(mail, '/unsubscribe/')).toContain('/unsubscribe/');
    const link = linkFrom(mail, '/v/');
    expect(link).toContain(`/v/${slug}`);
    const response = await athlete.goto(link);
    expect(response?.status()).toBe(200);
    await expect.poll(() => athlete.getByRole('heading', { level: 1, name: claim }).isVisible()).toBe(true);
    expect(await athlete.getByText('Verdict:').isVisible()).toBe(true);
    expect(await athlete.getByRole('complementary', { name: 'Safety' }).first().isVisible()).toBe(true);
    expect(await athlete.getByRole('heading', { name: 'The protocol, in everyday words' }).isVisible()).toBe(true);
    expect(await athlete.getByRole('table').getByText('70 kg').first().isVisible()).toBe(true);
    // Readable on a phone: nothing wider than the screen.
    expect(await athlete.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await athlete.screenshot({ path: '/tmp/verdict-phone.png', fullPage: true });

    // Months later: a half-remembered, misspelled word on the verdicts page finds it again.
    await athlete.goto('/verdicts');
    await athlete.getByLabel('Search the verdicts').fill('sawna pulleys');
    const hit = athlete.getByRole('link', { name: claim });
    await expect.poll(() => hit.isVisible()).toBe(true);
    // The list shows newest first until the search answers; the highlighted words mark the answer.
    await expect.poll(() => athlete.locator('mark').first().isVisible()).toBe(true);
    await athlete.screenshot({ path: '/tmp/verdict-search-phone.png', fullPage: true });
    await hit.click();
    await athlete.waitForURL(`**/v/${slug}`);

    // The cached public page follows publishing at once: 404 to a signed-out reader while the
    // verdict is team-only, readable the moment the owner publishes it for everyone.
    const visitorContext = await browser.newContext({ viewport: PHONE });
    const visitor = await visitorContext.newPage();
    expect((await visitor.goto(`/v/${slug}`))?.status()).toBe(404);
    const republished = await owner.request.post(`/api/reviews/${reviewId}/publish`, {
      data: { visibility: 'public', changeNote: 'Shared with everyone after a second read.' },
    });
    expect(republished.status()).toBe(201);
    expect((await visitor.goto(`/v/${slug}`))?.status()).toBe(200);
    expect(await visitor.getByText(/What changed in this version: Shared with everyone/).isVisible()).toBe(true);
    expect(await visitor.getByRole('link', { name: 'Sign in' }).isVisible()).toBe(true);

    // The mail's other link: opening it only asks (mail scanners open links); the button stops the mails.
    await athlete.goto(linkFrom(mail, '/unsubscribe/'));
    await athlete.getByRole('button', { name: 'Stop these e-mails' }).click();
    await expect
      .poll(() => athlete.getByRole('status').filter({ hasText: 'you will get no more e-mails' }).isVisible())
      .toBe(true);

    await visitorContext.close();
    await athleteContext.close();
    await ownerContext.close();
  });
});

describe('what a signed-out visitor sees', () => {
  it('reads a public verdict, with its versions, and gets 404 for a team-only one', async () => {
    const context = await browser.newContext({ viewport: PHONE });
    const page = await context.newPage();
    const scripts: string[] = [];
    page.on('request', (r) => {
      if (r.resourceType() === 'script') scripts.push(r.url());
    });
    const ok = await page.goto('/v/cold-plunges-after-strength');
    expect(ok?.status()).toBe(200);
    // Plain reading on a phone: the page loads no JavaScript at all.
    expect(scripts).toEqual([]);
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toMatch(/cold plunge/i);
    expect(await page.getByText(/Version 2, published/).isVisible()).toBe(true);
    await page.getByRole('link', { name: /All versions and what changed/ }).click();
    await page.waitForURL('**/v/cold-plunges-after-strength/versions');
    expect(await page.getByText(/What changed: Added what to do instead/).isVisible()).toBe(true);
    await page.getByRole('link', { name: 'Version 1' }).click();
    await expect.poll(() => page.getByText(/You are reading version 1, an earlier version/).isVisible()).toBe(true);

    scripts.length = 0; // the versions pages above are App Router pages, with their scripts
    const hidden = await page.goto('/v/weighted-pull-up-ladder');
    expect(hidden?.status()).toBe(404);
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('This verdict was not found');
    expect(await page.getByText(/the verdict is shared only with its team’s members/).isVisible()).toBe(true);
    // Its 404 is as plain as the verdict page: still no JavaScript.
    expect(scripts).toEqual([]);
    expect(await page.content()).not.toMatch(/lock-off/i);

    const feed = await page.request.get('/feed.xml');
    expect(feed.headers()['content-type']).toContain('application/atom+xml');
    expect(await feed.text()).toContain('/v/cold-plunges-after-strength');
    await context.close();
  });
});

describe('accessibility of the verdict page', () => {
  it('axe-core finds no serious or critical violation on /v/[slug], on a desktop and on a phone', async () => {
    for (const viewport of [undefined, PHONE]) {
      const context = await browser.newContext({ viewport });
      const page = await context.newPage();
      await page.goto('/v/cold-plunges-after-strength');
      expect(await seriousAxeViolations(page)).toEqual([]);
      await context.close();
    }
  });

  it('the axe check itself fails on a page with a known serious violation (so the check above can fail)', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.setContent(
      '<html lang="en"><body><main><img src="x.png"><p style="color:#eee;background:#fff">faint</p></main></body></html>',
    );
    expect((await seriousAxeViolations(page)).join('\n')).toMatch(/image-alt|color-contrast/);
    await context.close();
  });
});

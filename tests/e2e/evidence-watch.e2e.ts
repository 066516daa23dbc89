import { describe, expect, it } from 'vitest';
import { signInWithForm, useBrowser, waitForMail } from './browser';

const browser = useBrowser();
const PHONE = { width: 390, height: 844 };


describe('the evidence watch', () => {
  it('the owner runs it and sees the flagged verdict; the athlete’s page says a cited study changed; the author gets the mail', async () => {
    // The registry fake (started by global-setup) says the demo study cited by the pull-up
    // ladder verdict was corrected; the seed has not applied that yet.
    const ownerContext = await browser.newContext();
    const owner = await ownerContext.newPage();
    await signInWithForm(owner, 'owner@granite-hollow.test');
    await owner.goto('/library');
    const panel = owner.getByTestId('evidence-watch');
    await panel.getByRole('button', { name: 'Check the library now' }).click();
    await expect
      .poll(() => panel.getByTestId('watch-summary').textContent(), { timeout: 30_000 })
      .toMatch(/1 verdict flagged/);
    const flags = panel.getByTestId('evidence-flags');
    await expect.poll(() => flags.textContent()).toMatch(/Weighted pull-up ladder[\s\S]*Corrected 27 Nov 2026/);
    // The seeded retraction stays flagged on the cold-plunge verdict.
    expect(await flags.textContent()).toMatch(/Cold plunges after strength sessions[\s\S]*Retracted 20 Nov 2026/);
    // The library marks the study where it is listed.
    expect(await owner.locator('[data-testid=study-notice]:visible').count()).toBeGreaterThanOrEqual(2);

    // The author (the owner wrote the pull-up ladder review) is mailed.
    const mail = await waitForMail(
      (m) => m.to.includes('owner@granite-hollow.test') && /Evidence changed: Weighted pull-up ladder/.test(m.subject),
    );
    expect(mail.text).toMatch(/corrected on 27 Nov 2026/);
    expect(mail.text).toMatch(/\/v\/weighted-pull-up-ladder/);
    await ownerContext.close();

    // A team athlete on a phone reads the notice above the verdict.
    const athleteContext = await browser.newContext({ viewport: PHONE });
    const athlete = await athleteContext.newPage();
    await signInWithForm(athlete, 'athlete@granite-hollow.test');
    await athlete.goto('/v/weighted-pull-up-ladder');
    const notice = athlete.getByTestId('evidence-changed');
    expect(await notice.textContent()).toMatch(/was corrected on 27 Nov 2026[\s\S]*re-reviewing/);
    await athleteContext.close();

    // Signed out, the public cold-plunge page (served from the page cache) says the study was retracted.
    const publicContext = await browser.newContext({ viewport: PHONE });
    const reader = await publicContext.newPage();
    await reader.goto('/v/cold-plunges-after-strength');
    expect(await reader.getByTestId('evidence-changed').textContent()).toMatch(
      /was retracted on 20 Nov 2026[\s\S]*re-reviewing/,
    );
    await publicContext.close();
  });
});

import { describe, expect, it } from 'vitest';
import { useBrowser } from './browser';

const browser = useBrowser();

describe("the owner's publishing rules", () => {
  it('turns the peer-review requirement off and on again, and the page remembers it', async () => {
    const context = await browser.newContext();
    expect(
      (
        await context.request.post('/api/auth/sign-in', {
          data: { email: 'owner@granite-hollow.test', password: 'loadbearing-demo' },
        })
      ).status(),
    ).toBe(200);
    const page = await context.newPage();
    const box = () => page.getByLabel('Require a peer-review round before publishing');
    const save = async () => {
      await page.getByRole('button', { name: 'Save publishing rules' }).click();
      await expect.poll(() => page.getByText('Publishing rules saved.').isVisible()).toBe(true);
    };
    await page.goto('/team');
    expect(await box().isChecked()).toBe(true);
    await box().uncheck();
    await save();
    await page.reload();
    expect(await box().isChecked()).toBe(false);
    // Put the seeded rule back for the other journeys.
    await box().check();
    await save();
    await page.reload();
    expect(await box().isChecked()).toBe(true);

    // A coach does not see the rules at all.
    const coachContext = await browser.newContext();
    await coachContext.request.post('/api/auth/sign-in', {
      data: { email: 'coach@granite-hollow.test', password: 'loadbearing-demo' },
    });
    const coach = await coachContext.newPage();
    await coach.goto('/team');
    expect(await coach.getByRole('heading', { name: 'Publishing rules' }).count()).toBe(0);
    await context.close();
    await coachContext.close();
  });
});

import { inject, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import sqlite3 from 'sqlite3';
import { linkFrom, signUpByApi, useBrowser, waitForMail } from './browser';

/**
 * The peer-review journey in chromium: an author opens a round for two reviewers, both get the
 * invitation at the mail fake and score blind in their own browsers, the author sees α and the
 * flagged mechanism, resolves it, closes the round, and the review is approved. Every account is
 * made here with e-mails no other test uses.
 */

const browser = useBrowser();
const stamp = Date.now().toString(36);
const PASSWORD = 'rounds-journey-pass-1';
const people = {
  author: { name: 'Alda Quarry', email: `alda.${stamp}@rounds-e2e.test` },
  first: { name: 'Bram Cliff', email: `bram.${stamp}@rounds-e2e.test` },
  second: { name: 'Cleo Scree', email: `cleo.${stamp}@rounds-e2e.test` },
};
const SHOTS = process.env.ROUNDS_SCREENSHOT_DIR ?? '/tmp';

let teamId: number;
let reviewId: number;
let mechanismIds: number[];
const userIds: Record<string, number> = {};

async function signUp(person: { name: string; email: string }) {
  const { userId, teamId } = await signUpByApi({ ...person, password: PASSWORD, teamName: `${person.name} Lab` });
  return { userId, teamId };
}

/** Adds a member to the author's team straight in the e2e database (the team invitation flow has its own journey in auth.e2e.ts). */
function addMember(userId: number, role: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const database = new sqlite3.Database(inject('databaseFile'));
    database.configure('busyTimeout', 5000);
    const now = new Date().toISOString();
    database.run(
      'INSERT INTO memberships (teamId, userId, role, createdAt, updatedAt) VALUES (?, ?, ?, ?, ?)',
      [teamId, userId, role, now, now],
      (error) => database.close(() => (error ? reject(error) : resolve())),
    );
  });
}

async function signInAs(page: Page, email: string, password: string) {
  await page.fill('input[name=email]', email);
  await page.fill('input[name=password]', password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}
const signIn = (page: Page, email: string) => signInAs(page, email, PASSWORD);

async function scoreAndSubmit(context: BrowserContext, email: string, link: string, bands: number[], shots?: string) {
  const page = await context.newPage();
  await page.goto(link);
  // Signed out: the proxy sends the reviewer to sign in, and back to the scorecard after.
  await page.waitForURL('**/sign-in**');
  await signIn(page, email);
  await page.waitForURL(
    (url) => url.pathname === `/reviews/${reviewId}/round/${new URL(link).pathname.split('/').pop()}`,
  );
  await expect.poll(() => page.getByRole('heading', { name: 'Score each mechanism' }).isVisible()).toBe(true);
  // Blind: nothing of the engine on the page.
  expect(await page.getByText(/Holds up|Does not hold up|Unsettled|probability/i).count()).toBe(0);
  for (const [i, id] of mechanismIds.entries()) {
    await page.locator(`input[name="band-${id}"][value="${bands[i]}"]`).check({ force: true });
    await page.locator(`input[name="contribution-${id}"][value="moderate"]`).check({ force: true });
  }
  await page.fill(`#comment-${mechanismIds[1]}`, `Tendon view from ${email.split('.')[0]}.`);
  await page.locator('input[name="signOff"][value="approve"]').check({ force: true });
  await expect.poll(() => page.getByText(/Draft saved/).isVisible()).toBe(true);
  if (shots) {
    await page.screenshot({ path: `${SHOTS}/rounds-scorecard-1280.png`, fullPage: true });
    await page.setViewportSize({ width: 375, height: 800 });
    await page.screenshot({ path: `${SHOTS}/rounds-scorecard-375.png`, fullPage: true });
    await page.setViewportSize({ width: 1280, height: 900 });
  }
  await page.getByRole('button', { name: 'Submit scorecard' }).click();
  await page.getByRole('button', { name: 'Yes, submit' }).click();
  await expect.poll(() => page.getByText('Your scores are final.').isVisible()).toBe(true);
  return page;
}

beforeAll(async () => {
  const author = await signUp(people.author);
  teamId = author.teamId;
  userIds.author = author.userId;
  userIds.first = (await signUp(people.first)).userId;
  userIds.second = (await signUp(people.second)).userId;
  await addMember(userIds.first, 'reviewer');
  await addMember(userIds.second, 'coach');
});

describe('a blind peer-review round from opening to approval', () => {
  it('runs end to end in three browsers', async () => {
    const authorContext = await browser.newContext();
    const author = await authorContext.newPage();
    await author.goto('/sign-in');
    await signIn(author, people.author.email);
    await author.waitForURL('**/dashboard');

    // The review under test, through the same API the workbench uses.
    const created = await author.request.post('/api/reviews', {
      data: {
        teamId,
        title: `Rounds journey ${stamp}`,
        claim: 'Three weeks of daily dead hangs double finger strength.',
        claimSource: 'An invented forum post',
        claimUrl: null,
        protocol: { exercise: 'Dead hang', loadValue: 60, loadUnit: 'percent-max', effort: 'moderate' },
        population: { status: 'recreational', injured: false },
        tags: ['fingers'],
      },
    });
    expect(created.status()).toBe(201);
    reviewId = (await created.json()).review.id;
    mechanismIds = [];
    for (const name of ['Neural drive to the finger flexors', 'Tendon stiffening', 'Learning the test']) {
      const res = await author.request.post(`/api/reviews/${reviewId}/mechanisms`, { data: { name } });
      expect(res.status()).toBe(201);
      mechanismIds.push((await res.json()).mechanism.id);
    }

    // Open the round for both reviewers.
    await author.goto(`/reviews/${reviewId}/rounds`);
    await author.getByLabel(people.first.name, { exact: false }).check();
    await author.getByLabel(people.second.name, { exact: false }).check();
    await author.getByRole('button', { name: 'Open round and send invitations' }).click();
    await expect
      .poll(() => author.getByText('Round opened and invitations sent.').isVisible())
      .toBe(true);

    const mailFirst = await waitForMail(
      (m) => m.to.includes(people.first.email) && m.subject.includes('Peer review requested'),
    );
    const mailSecond = await waitForMail(
      (m) => m.to.includes(people.second.email) && m.subject.includes('Peer review requested'),
    );
    const linkFirst = linkFrom(mailFirst, `/reviews/${reviewId}/round/`);
    const linkSecond = linkFrom(mailSecond, `/reviews/${reviewId}/round/`);

    // Each reviewer scores blind in their own browser: they disagree by three bands on tendons.
    const firstContext = await browser.newContext();
    const secondContext = await browser.newContext();
    await scoreAndSubmit(firstContext, people.first.email, linkFirst, [5, 1, 3], 'shots');
    const second = await scoreAndSubmit(secondContext, people.second.email, linkSecond, [5, 4, 3]);
    // After submitting, the reviewer sees the agreement.
    await expect.poll(() => second.getByTestId('alpha').isVisible()).toBe(true);
    await waitForMail(
      (m) => m.to.includes(people.author.email) && m.subject.includes(`${people.second.name} submitted`),
    );

    // The author sees α and the flagged mechanism, resolves it and closes the round.
    await author.reload();
    await expect.poll(() => author.getByTestId('alpha').first().textContent()).toMatch(/^-?\d\.\d{3}$/);
    const flagged = author.locator(`#agreement-${mechanismIds[1]}`);
    await expect.poll(() => flagged.getByText('Flagged', { exact: true }).isVisible()).toBe(true);
    await author.screenshot({ path: `${SHOTS}/rounds-agreement-1280.png`, fullPage: true });
    await author.setViewportSize({ width: 375, height: 800 });
    await author.screenshot({ path: `${SHOTS}/rounds-agreement-375.png`, fullPage: true });
    await author.setViewportSize({ width: 1280, height: 900 });

    await flagged.getByLabel('Keep as it is').check();
    await flagged
      .getByLabel('Why it stays as it is')
      .fill('The tendon evidence is thin either way; noted both readings in the text.');
    await flagged.getByRole('button', { name: 'Record resolution' }).click();
    await expect.poll(() => flagged.getByText('Flag resolved').isVisible()).toBe(true);

    // Closing asks first (it cannot be undone).
    author.once('dialog', (dialog) => void dialog.accept());
    await author.getByRole('button', { name: 'Close the round' }).click();
    await expect
      .poll(() => author.getByText('Round closed: the review is now approved.').isVisible())
      .toBe(true);
    const review = await author.request.get(`/api/reviews/${reviewId}`);
    expect((await review.json()).review.status).toBe('approved');
    await waitForMail((m) => m.to.includes(people.first.email) && m.subject.includes('Peer review closed'));

    for (const context of [authorContext, firstContext, secondContext]) await context.close();
  }, 120_000);
});

describe('the seeded open round', () => {
  it('shows the demo reviewer the author’s analysis, evidence and her saved draft, and nothing of the engine', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto('/sign-in');
    await signInAs(page, 'reviewer@granite-hollow.test', 'loadbearing-demo');
    await page.waitForURL('**/dashboard');
    // Her dashboard leads to the scorecard she still owes, without the invitation mail.
    const waiting = page.getByRole('region', { name: 'Scorecards waiting for you' });
    await expect.poll(() => waiting.getByText('Draft saved: finish and submit').isVisible()).toBe(true);
    await waiting.getByRole('link').first().click();
    await page.waitForURL('**/reviews/*/round/*');
    const list = await page.request.get('/api/reviews');
    const pinch = ((await list.json()).reviews as { id: number; slug: string }[]).find(
      (r) => r.slug === 'light-daily-pinch-block-lifts',
    )!;
    // Not the author or owner: the round page sends her to her own scorecard.
    await page.goto(`/reviews/${pinch.id}/rounds`);
    await page.waitForURL(`**/reviews/${pinch.id}/round/*`);
    await expect.poll(() => page.getByRole('heading', { name: 'The author’s analysis' }).isVisible()).toBe(true);
    expect(await page.getByText('Candidate mechanisms').first().isVisible()).toBe(true);
    // Her seeded draft: band 1 on the first mechanism.
    const first = page.locator('input[name^="band-"]').first();
    const name = await first.getAttribute('name');
    expect(await page.locator(`input[name="${name}"][value="1"]`).isChecked()).toBe(true);
    expect(await page.getByText(/Does not hold up|Far below any loading/).count()).toBe(0);
    await page.screenshot({ path: `${SHOTS}/rounds-scorecard-seeded-1280.png`, fullPage: true });
    await context.close();
  });
});

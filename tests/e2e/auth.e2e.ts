import { describe, expect, it } from 'vitest';
import { linkFrom, signInByApi, signUpByApi, useBrowser, waitForMail } from './browser';

const browser = useBrowser();
const DEMO_PASSWORD = 'loadbearing-demo';
// A form's answer waits on password hashing (bcrypt), slow when the machine is busy.
const SLOW = { timeout: 15_000 };

async function signIn(page: import('playwright-core').Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.fill('input[name=email]', email);
  await page.fill('input[name=password]', password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

describe('signing up, in and out', () => {
  it('a new coach signs up, opens the mailed link and lands on the dashboard with their team', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto('/sign-up');
    await page.fill('input[name=name]', 'Rhea Ledge');
    await page.fill('input[name=email]', 'rhea@example.test');
    await page.fill('input[name=password]', 'rhea-password-1');
    await page.fill('input[name=teamName]', 'Ledge Strength Club');
    await page.getByRole('button', { name: 'Create account' }).click();
    await expect.poll(() => page.getByRole('heading', { name: 'Check your mail' }).isVisible(), SLOW).toBe(true);
    expect(await page.getByTestId('check-your-mail').textContent()).toContain('rhea@example.test');
    expect(new URL(page.url()).pathname).toBe('/sign-up');

    const mail = await waitForMail((m) => m.to.includes('rhea@example.test') && /Confirm/.test(m.subject));
    const link = linkFrom(mail, '/sign-up/confirm');
    await page.goto(link);
    await expect.poll(() => page.getByText('Ledge Strength Club').first().isVisible(), SLOW).toBe(true);
    await page.getByRole('button', { name: 'Create my account and team' }).click();
    await page.waitForURL('**/dashboard');
    await expect.poll(() => page.getByRole('heading', { name: 'Dashboard' }).isVisible()).toBe(true);
    await expect.poll(() => page.getByText('Ledge Strength Club').filter({ visible: true }).count()).toBeGreaterThan(0);

    // The link is spent: opened again it says so, in a browser that is not signed in.
    const other = await (await browser.newContext()).newPage();
    await other.goto(link);
    await expect
      .poll(() => other.getByRole('heading', { name: 'This link was already used' }).isVisible(), SLOW)
      .toBe(true);
    await other.context().close();
    await context.close();
  });

  it('signing up with a taken address shows the same page; the mail there says sign in', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto('/sign-up');
    await page.fill('input[name=name]', 'Someone Else');
    await page.fill('input[name=email]', 'owner@granite-hollow.test');
    await page.fill('input[name=password]', 'another-password-1');
    await page.fill('input[name=teamName]', 'A Second Team');
    await page.getByRole('button', { name: 'Create account' }).click();
    await expect.poll(() => page.getByRole('heading', { name: 'Check your mail' }).isVisible(), SLOW).toBe(true);
    const mail = await waitForMail((m) => m.to.includes('owner@granite-hollow.test') && /already have/.test(m.subject));
    expect(mail.text).toContain('/reset-password');
    // "Use a different address" goes back to the form with what was typed, but the password.
    await page.getByRole('button', { name: 'Use a different address' }).click();
    expect(await page.inputValue('input[name=email]')).toBe('owner@granite-hollow.test');
    expect(await page.inputValue('input[name=password]')).toBe('');
    await context.close();
  });

  it('an unknown sign-up link says it is not valid', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto('/sign-up/confirm?token=not-a-real-token-at-all');
    await expect.poll(() => page.getByRole('heading', { name: 'This link is not valid' }).isVisible()).toBe(true);
    await context.close();
  });

  it('shows inline errors for a bad sign-up and keeps what was typed', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto('/sign-up');
    await page.fill('input[name=name]', 'Short Pass');
    await page.fill('input[name=email]', 'short@example.test');
    await page.fill('input[name=password]', 'short');
    await page.fill('input[name=teamName]', 'Tiny Team');
    await page.getByRole('button', { name: 'Create account' }).click();
    await expect.poll(() => page.getByText('Use at least 10 characters.').isVisible()).toBe(true);
    expect(await page.inputValue('input[name=email]')).toBe('short@example.test');
    expect(page.url()).toMatch(/\/sign-up/);
    await context.close();
  });

  it('signs out, then signs back in; signed-out visitors of app pages go to sign-in', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, 'rhea@example.test', 'rhea-password-1');
    await page.waitForURL('**/dashboard');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await page.goto('/dashboard');
    await page.waitForURL('**/sign-in?next=%2Fdashboard');
    await page.fill('input[name=email]', 'rhea@example.test');
    await page.fill('input[name=password]', 'rhea-password-1');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/dashboard');
    await context.close();
  });

  it('five wrong passwords show the rate-limit message', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    for (let i = 0; i < 5; i++) {
      await signIn(page, 'coach@granite-hollow.test', `wrong-password-${i}`);
      await page.waitForSelector('[role=alert], [aria-live] >> text=/match|Too many/');
    }
    await expect.poll(() => page.getByText(/Too many failed sign-ins/).isVisible()).toBe(true);
    await context.close();
  });

  it('asking for too many mails from one network says so on the form (server action, not only the API)', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto('/reset-password');
    // lib/auth/mail-limit.ts: 10 mail requests per client address per hour.
    for (let i = 0; i <= 10; i++) {
      await page.fill('input[name=email]', `nobody-${i}@mail-limit.test`);
      await page.getByRole('button', { name: 'Send reset link' }).click();
      await page.waitForSelector(`text=/nobody-${i}@mail-limit.test, a reset link|Too many e-mails/`, SLOW);
    }
    await expect.poll(() => page.getByText(/Too many e-mails asked for from this network/).isVisible()).toBe(true);
    await context.close();
  });
});

describe('inviting a colleague', () => {
  it('the demo owner invites a coach; the mail arrives; the coach joins in a second browser and sees the team', async () => {
    const ownerContext = await browser.newContext();
    const owner = await ownerContext.newPage();
    await signIn(owner, 'owner@granite-hollow.test', DEMO_PASSWORD);
    await owner.waitForURL('**/dashboard');
    await owner.goto('/team');
    await owner.fill('input[name=email]', 'newcoach@example.test');
    await owner.selectOption('select[name=role]', 'coach');
    await owner.getByRole('button', { name: 'Send invitation' }).click();
    await expect
      .poll(() => owner.getByText('newcoach@example.test').first().isVisible(), { timeout: 15_000 })
      .toBe(true);

    const mail = await waitForMail((m) => m.to.includes('newcoach@example.test'));
    expect(mail.subject).toContain('Granite Hollow Training Lab');
    const link = linkFrom(mail, '/invitations/');

    const coachContext = await browser.newContext();
    const coach = await coachContext.newPage();
    await coach.goto(link);
    await coach.fill('input[name=name]', 'Nell Newcoach');
    await coach.fill('input[name=password]', 'newcoach-password');
    await coach.getByRole('button', { name: 'Join team' }).click();
    await coach.waitForURL('**/dashboard');
    // The dashboard names the team (its list and its reviews section); some matches sit in hidden menus.
    await expect
      .poll(() => coach.getByText('Granite Hollow Training Lab').filter({ visible: true }).count())
      .toBeGreaterThan(0);
    await expect.poll(() => coach.getByText(/coach/i).filter({ visible: true }).count()).toBeGreaterThan(0);

    await owner.reload();
    await expect.poll(() => owner.getByText('Nell Newcoach').first().isVisible()).toBe(true);
    await ownerContext.close();
    await coachContext.close();
  });
});

describe('changing the password', () => {
  const SHOTS = process.env.ACCOUNT_SCREENSHOT_DIR ?? '/tmp';
  const person = {
    name: 'Pia Arete',
    email: 'pia.arete@example.test',
    password: 'pia-old-password-1',
    teamName: 'Arete Physio',
  };

  it('from the header to the account page: the other session ends, this one stays, the old password is refused', async () => {
    await signUpByApi(person);
    // A second session of the same person, elsewhere.
    const elsewhere = await signInByApi(person.email, person.password);
    expect((await fetch(`${browser.baseURL}/api/me`, { headers: { cookie: elsewhere } })).status).toBe(200);

    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, person.email, person.password);
    await page.waitForURL('**/dashboard');
    await page.getByTestId('signed-in-user').click();
    await page.waitForURL('**/account');
    await expect.poll(() => page.getByRole('heading', { name: 'Change your password' }).isVisible()).toBe(true);

    // A wrong current password is refused beside its field.
    await page.fill('input[name=currentPassword]', 'not-my-password');
    await page.fill('input[name=newPassword]', 'pia-new-password-2');
    await page.getByRole('button', { name: 'Change password' }).click();
    await expect.poll(() => page.getByText('This is not your current password.').isVisible(), SLOW).toBe(true);

    await page.fill('input[name=currentPassword]', person.password);
    await page.fill('input[name=newPassword]', 'pia-new-password-2');
    await page.getByRole('button', { name: 'Change password' }).click();
    await expect.poll(() => page.getByText(/Your password is changed/).isVisible(), SLOW).toBe(true);
    await page.screenshot({ path: `${SHOTS}/account-password-1280.png`, fullPage: true });

    // This browser is still signed in; the other session is not.
    await page.goto('/dashboard');
    await expect.poll(() => page.getByRole('heading', { name: 'Dashboard' }).isVisible()).toBe(true);
    expect((await fetch(`${browser.baseURL}/api/me`, { headers: { cookie: elsewhere } })).status).toBe(401);
    await expect(signInByApi(person.email, person.password)).rejects.toThrow(/401/);
    expect(await signInByApi(person.email, 'pia-new-password-2')).toMatch(/^loadbearing_session=/);

    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto('/account');
    await expect.poll(() => page.getByRole('heading', { name: 'Change your password' }).isVisible()).toBe(true);
    await page.screenshot({ path: `${SHOTS}/account-password-390.png`, fullPage: true });
    await context.close();
  });
});

import { afterAll, beforeAll, inject } from 'vitest';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { readDropInbox } from '../../lib/mail/inbox';
import type { ReceivedMail } from '../../lib/mail/fake-smtp';

export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

let counter = 0;

/** One browser per test file; each context is a separate person with a distinct client address. */
export function useBrowser() {
  let browser: Browser;
  beforeAll(async () => {
    browser = await chromium.launch({
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: CHROMIUM_ARGS,
    });
  });
  afterAll(async () => {
    await browser?.close();
  });
  return {
    baseURL: inject('baseURL'),
    async newContext(opts: { viewport?: { width: number; height: number } } = {}): Promise<BrowserContext> {
      // A distinct address per person, so one journey's failed sign-ins do not throttle another's.
      const address = `10.${process.pid % 250}.${Math.floor(++counter / 250)}.${counter % 250}`;
      return browser.newContext({
        baseURL: inject('baseURL'),
        viewport: opts.viewport ?? { width: 1280, height: 900 },
        extraHTTPHeaders: { 'x-forwarded-for': address },
      });
    },
  };
}

/** Waits for a mail at the fake (read from its drop folder) that matches. */
export async function waitForMail(match: (mail: ReceivedMail) => boolean, timeoutMs = 15_000): Promise<ReceivedMail> {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    const found = (await readDropInbox(inject('mailDir'))).find(match);
    if (found) return found;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('No matching mail arrived at the fake in time.');
}

export function linkFrom(mail: ReceivedMail, pathPrefix: string): string {
  const match = mail.text.match(new RegExp(`https?://\\S+${pathPrefix.replace(/[/]/g, '\\/')}\\S*`));
  if (!match) throw new Error(`No ${pathPrefix} link in mail "${mail.subject}"`);
  return match[0];
}

/** Every demo account's password (demo data only). */
export const DEMO_PASSWORD = 'loadbearing-demo';

/** Signs in through the form, as a person would, and waits for the dashboard. */
export async function signInWithForm(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.fill('input[name=email]', email);
  await page.fill('input[name=password]', password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL('**/dashboard');
}

/** The session cookie (name=value) from a response's Set-Cookie headers. */
function sessionCookie(res: Response): string {
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith('loadbearing_session='));
  if (!cookie) throw new Error('No session cookie in the answer.');
  return cookie.split(';')[0];
}

let apiCounter = 0;
const apiAddress = () => `10.241.${process.pid % 250}.${++apiCounter % 250}`;

/**
 * Signs up through the API as a person does: the request, the link from the mail at the fake,
 * the confirm. Answers the new account's ids and its session cookie.
 */
export async function signUpByApi(person: { name: string; email: string; password: string; teamName: string }) {
  const baseURL = inject('baseURL');
  const headers = { 'content-type': 'application/json', 'x-forwarded-for': apiAddress() };
  const requested = await fetch(`${baseURL}/api/auth/sign-up`, {
    method: 'POST',
    headers,
    body: JSON.stringify(person),
  });
  if (requested.status !== 202) throw new Error(`sign-up answered ${requested.status}: ${await requested.text()}`);
  const mail = await waitForMail((m) => m.to.includes(person.email.toLowerCase()) && /Confirm/.test(m.subject));
  const token = new URL(linkFrom(mail, '/sign-up/confirm')).searchParams.get('token');
  const confirmed = await fetch(`${baseURL}/api/auth/sign-up/confirm`, {
    method: 'POST',
    headers,
    body: JSON.stringify({ token }),
  });
  if (confirmed.status !== 201) throw new Error(`confirm answered ${confirmed.status}: ${await confirmed.text()}`);
  const body = (await confirmed.json()) as { user: { id: number }; team: { id: number } };
  return { userId: body.user.id, teamId: body.team.id, cookie: sessionCookie(confirmed) };
}

/** Signs in through the API; answers the session cookie. */
export async function signInByApi(email: string, password: string): Promise<string> {
  const res = await fetch(`${inject('baseURL')}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-forwarded-for': apiAddress() },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in answered ${res.status}`);
  return sessionCookie(res);
}

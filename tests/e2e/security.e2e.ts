import type { Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { signInByApi, signUpByApi, useBrowser } from './browser';

const browser = useBrowser();
const baseURL = inject('baseURL');

/** Loads a page and collects every CSP violation the browser reports in its console. */
async function violations(page: Page, path: string): Promise<string[]> {
  const found: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy|Content-Security-Policy/i.test(message.text()))
      found.push(`${path}: ${message.text()}`);
  });
  await page.goto(path);
  await page.waitForLoadState('networkidle');
  return found;
}

describe('security headers', () => {
  it('every main page works under its Content-Security-Policy: no violation in the console', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const found: string[] = [];
    // Unknown addresses too: the 404 pages must work under the policy like any page.
    for (const path of [
      '/',
      '/sign-in',
      '/sign-up',
      '/reset-password',
      '/verdicts',
      '/no-such-page',
      '/v/no-such-verdict',
    ])
      found.push(...(await violations(page, path)));
    await page.goto('/sign-in');
    // The owner: auth.e2e.ts tries wrong passwords for the coach, which delays that account.
    await page.fill('input[name=email]', 'owner@granite-hollow.test');
    await page.fill('input[name=password]', 'loadbearing-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/dashboard');
    for (const path of ['/dashboard', '/reviews', '/library', '/search?q=hang', '/team', '/reviews/new']) {
      found.push(...(await violations(page, path)));
    }
    // A workbench, where the editor runs.
    const reviews = await (await page.request.get('/api/reviews')).json();
    found.push(...(await violations(page, `/reviews/${reviews.reviews[0].id}`)));
    expect(found).toEqual([]);
    // React really ran (a client component answered a click would fail without its scripts).
    expect(await page.evaluate(() => typeof (window as unknown as { next?: unknown }).next)).toBe('object');
    await context.close();
    // Fourteen pages, each until the network is idle: minutes on a busy machine.
  }, 180_000);

  it('sends the headers on pages, API answers and files', async () => {
    for (const path of ['/', '/sign-in', '/api/verdicts', '/v/no-such-verdict', '/favicon.ico']) {
      const res = await fetch(`${baseURL}${path}`);
      expect(res.headers.get('x-content-type-options'), path).toBe('nosniff');
      expect(res.headers.get('referrer-policy'), path).toBeTruthy();
      expect(res.headers.get('content-security-policy') ?? res.headers.get('x-frame-options'), path).toBeTruthy();
    }
    expect((await fetch(`${baseURL}/sign-in`)).headers.get('content-security-policy')).toMatch(/'nonce-[^']+'/);
  });

  it('a server action posted from another site gets 403, not 500', async () => {
    const res = await fetch(`${baseURL}/sign-in`, {
      method: 'POST',
      headers: { origin: 'http://evil.test', 'next-action': 'x', 'content-type': 'text/plain' },
      body: '[]',
    });
    expect(res.status).toBe(403);
  });
});

describe('the 404 page', () => {
  it('is never cached with request data: a second missing path shows nothing of the first', async () => {
    const first = await fetch(`${baseURL}/private-thing-one?token=SECRET-TOKEN-1`);
    expect(first.status).toBe(404);
    // The 404 is rendered for this request (it carries the request's CSP nonce), so it may hold
    // the address asked for — and therefore must never be stored by a browser or a proxy.
    expect(first.headers.get('cache-control')).toMatch(/no-store/);
    const second = await fetch(`${baseURL}/another-missing-page`);
    expect(second.status).toBe(404);
    const html = await second.text();
    expect(html).not.toContain('SECRET-TOKEN-1');
    expect(html).not.toContain('private-thing-one');
  });

  it("a signed-in person's 404 is rendered for them alone: the next person's shows nothing of it", async () => {
    const owner = await signInByApi('owner@granite-hollow.test', 'loadbearing-demo');
    const first = await fetch(`${baseURL}/reviews/987654?token=SECRET-TOKEN-2`, { headers: { cookie: owner } });
    expect(first.status).toBe(404);
    // This 404 carries its request — the signed-in name in the header, the path in the router
    // state — so one kept and served again would show it below: the check can fail.
    const firstHtml = await first.text();
    expect(firstHtml).toContain('Maren Holt');
    expect(firstHtml).toContain('987654');
    const other = (
      await signUpByApi({
        name: 'Lior Nextperson',
        email: `lior.${Date.now().toString(36)}@elsewhere.test`,
        password: 'next-person-pass-1',
        teamName: 'Next Person Club',
      })
    ).cookie;
    const second = await fetch(`${baseURL}/reviews/876543`, { headers: { cookie: other } });
    expect(second.status).toBe(404);
    const html = await second.text();
    expect(html).toContain('Lior Nextperson');
    for (const leak of ['Maren Holt', 'owner@granite-hollow.test', '987654', 'SECRET-TOKEN-2'])
      expect(html).not.toContain(leak);
  });
});

describe('a missing page under a loading state', () => {
  const get = (path: string, cookie: string) => fetch(`${baseURL}${path}`, { headers: { cookie }, redirect: 'manual' });

  it('a missing review, study or round answers status 404 to a signed-in member, not a 200 that streams the not-found UI', async () => {
    const owner = await signInByApi('owner@granite-hollow.test', 'loadbearing-demo');
    const reviews = (await (await get('/api/reviews', owner)).json()) as { reviews: { id: number }[] };
    const reviewId = reviews.reviews[0].id;
    for (const path of [
      '/reviews/999999',
      '/reviews/999999/rounds',
      `/reviews/${reviewId}/round/999999`,
      '/library/999999',
    ]) {
      const res = await get(path, owner);
      expect(res.status, path).toBe(404);
      expect(await res.text(), path).toMatch(/not found/i);
    }
    // Still there for what exists.
    expect((await get(`/reviews/${reviewId}`, owner)).status).toBe(200);
  });

  it("another team's review, study and round answer 404 exactly like missing ones", async () => {
    const owner = await signInByApi('owner@granite-hollow.test', 'loadbearing-demo');
    const reviewId = ((await (await get('/api/reviews', owner)).json()) as { reviews: { id: number }[] }).reviews[0].id;
    const studyId = ((await (await get('/api/studies', owner)).json()) as { studies: { id: number }[] }).studies[0].id;
    const rounds = (await (await get(`/api/reviews/${reviewId}/rounds`, owner)).json()) as { rounds: { id: number }[] };
    const stranger = (
      await signUpByApi({
        name: 'Vera Outside',
        email: `vera.${Date.now().toString(36)}@elsewhere.test`,
        password: 'outside-password-1',
        teamName: 'Elsewhere Club',
      })
    ).cookie;
    const paths = [`/reviews/${reviewId}`, `/reviews/${reviewId}/rounds`, `/library/${studyId}`];
    if (rounds.rounds[0]) paths.push(`/reviews/${reviewId}/round/${rounds.rounds[0].id}`);
    for (const path of paths) {
      const res = await get(path, stranger);
      expect(res.status, path).toBe(404);
    }
  });
});

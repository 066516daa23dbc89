import type { Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { useBrowser } from './browser';

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
    for (const path of ['/', '/sign-in', '/sign-up', '/reset-password', '/verdicts'])
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
    // Twelve pages, each until the network is idle: minutes on a busy machine.
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
    const second = await fetch(`${baseURL}/another-missing-page`);
    expect(second.status).toBe(404);
    const html = await second.text();
    expect(html).not.toContain('SECRET-TOKEN-1');
    expect(html).not.toContain('private-thing-one');
  });
});

import { afterAll, beforeAll, inject } from 'vitest';
import { chromium, type Browser, type BrowserContext } from 'playwright-core';
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
    browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: CHROMIUM_ARGS });
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

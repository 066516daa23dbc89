import { afterAll, beforeAll } from 'vitest';
import { migrate } from '@/db/migrate';
import { resetRateLimits } from '@/lib/auth/rate-limit';
import { db } from '@/lib/db';
import { startFakeSmtp, type FakeSmtp } from '@/lib/mail/fake-smtp';
import { stopListening } from '@/lib/search/change-feed';

/**
 * Migrates this file's database and starts a real SMTP fake that the app's mailer sends to.
 * Call once at the top of an integration test file.
 */
export function useTestApp(): { smtp: () => FakeSmtp } {
  let smtp: FakeSmtp;
  beforeAll(async () => {
    await migrate(db());
    smtp = await startFakeSmtp();
    process.env.SMTP_PORT = String(smtp.port);
    await resetRateLimits();
  });
  afterAll(async () => {
    await smtp?.close();
    await stopListening();
    await db().close();
  });
  return { smtp: () => smtp };
}

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

export interface CallResult<T = any> {
  status: number;
  headers: Headers;
  body: T;
}

/** A browser-like caller that keeps the session cookie between calls. */
export class Client {
  cookie = '';
  constructor(readonly address = '10.0.0.1') {}

  async call<T = any>(
    handler: Handler,
    opts: { method?: string; path?: string; params?: Record<string, string>; json?: unknown; rawBody?: string } = {},
  ): Promise<CallResult<T>> {
    const headers = new Headers({ 'x-forwarded-for': this.address });
    if (this.cookie) headers.set('cookie', this.cookie);
    let body: string | undefined;
    if (opts.rawBody !== undefined) body = opts.rawBody;
    else if (opts.json !== undefined) body = JSON.stringify(opts.json);
    if (body !== undefined) headers.set('content-type', 'application/json');
    const req = new Request(`http://app.test${opts.path ?? '/api/test'}`, { method: opts.method ?? (body === undefined ? 'GET' : 'POST'), headers, body });
    const res = await handler(req, { params: Promise.resolve(opts.params ?? {}) });
    for (const setCookie of res.headers.getSetCookie()) {
      const [pair] = setCookie.split(';');
      this.cookie = /=$/.test(pair) || /Max-Age=0/i.test(setCookie) ? '' : pair;
    }
    const text = await res.text();
    return { status: res.status, headers: res.headers, body: text ? JSON.parse(text) : null };
  }
}

/** The link inside a received mail's text part that starts with `prefix`. */
export function linkIn(text: string, prefix: string): string {
  const match = text.match(new RegExp(`${prefix.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}\\S+`));
  if (!match) throw new Error(`No link starting with ${prefix} in mail:\n${text}`);
  return match[0];
}

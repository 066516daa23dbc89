import { afterAll, beforeAll } from 'vitest';
import * as signUp from '@/app/api/auth/sign-up/route';
import * as confirmSignUp from '@/app/api/auth/sign-up/confirm/route';
import { migrate } from '@/db/migrate';
import { resetRateLimits } from '@/lib/auth/rate-limit';
import { db } from '@/lib/db';
import { startFakeSmtp, type FakeSmtp } from '@/lib/mail/fake-smtp';
import { stopListening } from '@/lib/search/change-feed';

/**
 * Migrates this file's database and starts a real SMTP fake that the app's mailer sends to.
 * Call once at the top of an integration test file.
 */
let activeSmtp: FakeSmtp | undefined;

export function useTestApp(): { smtp: () => FakeSmtp } {
  let smtp: FakeSmtp;
  beforeAll(async () => {
    await migrate(db());
    smtp = await startFakeSmtp();
    activeSmtp = smtp;
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
    const req = new Request(`http://app.test${opts.path ?? '/api/test'}`, {
      method: opts.method ?? (body === undefined ? 'GET' : 'POST'),
      headers,
      body,
    });
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

/**
 * Signs up the way a person does: POST /api/auth/sign-up, then the link from the mail the fake
 * relay received, posted to /api/auth/sign-up/confirm by the same client (which is then signed
 * in). Answers with the confirm call's result: 201 `{user, team}`, or the first failure.
 */
export async function signUpConfirmed(
  client: Client,
  input: { name: string; email: string; password: string; teamName: string },
): Promise<CallResult> {
  const smtp = activeSmtp;
  if (!smtp) throw new Error('signUpConfirmed needs useTestApp() in the test file.');
  const before = new Set(smtp.messages);
  const requested = await client.call(signUp.POST, { json: input });
  if (requested.status !== 202) return requested;
  const mail = await smtp.waitFor((m) => !before.has(m) && m.to.includes(input.email.trim().toLowerCase()));
  const link = linkIn(mail.text, 'http://app.test/sign-up/confirm?token=');
  const token = decodeURIComponent(new URL(link).searchParams.get('token')!);
  return client.call(confirmSignUp.POST, { json: { token } });
}

/** The sign-up link from the newest mail to `email` at the fake relay. */
export async function signUpToken(smtp: FakeSmtp, email: string, after = 0): Promise<string> {
  const mail = await smtp.waitFor(
    (m) => smtp.messages.indexOf(m) >= after && m.to.includes(email) && /Confirm/.test(m.subject),
  );
  return decodeURIComponent(
    new URL(linkIn(mail.text, 'http://app.test/sign-up/confirm?token=')).searchParams.get('token')!,
  );
}

import { afterEach, describe, expect, it, vi } from 'vitest';
import * as confirm from '@/app/api/auth/password-reset/confirm/route';
import * as reset from '@/app/api/auth/password-reset/route';
import * as signIn from '@/app/api/auth/sign-in/route';
import * as signOut from '@/app/api/auth/sign-out/route';
import * as me from '@/app/api/me/route';
import { SignInThrottle } from '@/models';
import { Client, linkIn, useTestApp, signUpConfirmed } from '../../helpers/app';

// A session ends on the server, not only in the browser that holds the cookie.
const app = useTestApp();
const password = 'a-long-password-1';

async function account(email: string): Promise<Client> {
  const client = new Client();
  const res = await signUpConfirmed(client, { name: 'Sela Vik', email, password, teamName: `Lab ${email}` });
  expect(res.status).toBe(201);
  return client;
}

function stolen(from: Client): Client {
  const thief = new Client('10.66.0.1');
  thief.cookie = from.cookie;
  return thief;
}

async function resetToken(email: string): Promise<string> {
  const before = app.smtp().messages.length;
  expect((await new Client().call(reset.POST, { json: { email } })).status).toBe(202);
  const mail = await app.smtp().waitFor((m) => m.to.includes(email) && app.smtp().messages.indexOf(m) >= before);
  return new URL(linkIn(mail.text, 'http://app.test/reset-password?token=')).searchParams.get('token')!;
}

afterEach(() => {
  vi.useRealTimers();
});

describe('sessions end on the server', () => {
  it('signing out ends a copied cookie too', async () => {
    const owner = await account('copied@example.test');
    const thief = stolen(owner);
    expect((await thief.call(me.GET)).status).toBe(200);
    expect((await owner.call(signOut.POST, { method: 'POST' })).status).toBe(200);
    expect((await thief.call(me.GET)).status).toBe(401);
    // Signing in again starts a fresh session that works.
    const again = new Client();
    expect((await again.call(signIn.POST, { json: { email: 'copied@example.test', password } })).status).toBe(200);
    expect((await again.call(me.GET)).status).toBe(200);
    expect((await thief.call(me.GET)).status).toBe(401);
  });

  it('a password reset ends every existing session', async () => {
    const owner = await account('reset-ends@example.test');
    const thief = stolen(owner);
    const token = await resetToken('reset-ends@example.test');
    expect((await new Client().call(confirm.POST, { json: { token, password: 'another-password-2' } })).status).toBe(
      200,
    );
    expect((await owner.call(me.GET)).status).toBe(401);
    expect((await thief.call(me.GET)).status).toBe(401);
  });

  it('10 confirms with one reset link at the same moment: exactly one succeeds', { timeout: 120_000 }, async () => {
    await account('race-reset@example.test');
    const token = await resetToken('race-reset@example.test');
    const results = await Promise.all(
      Array.from({ length: 10 }, (_, i) =>
        new Client().call(confirm.POST, { json: { token, password: `racing-password-${i}` } }),
      ),
    );
    expect(results.filter((r) => r.status === 200)).toHaveLength(1);
    expect(results.filter((r) => r.status === 400)).toHaveLength(9);
  });
});

describe('sign-in throttle', () => {
  it('guesses from elsewhere delay the account, they do not lock its owner out for the whole window', async () => {
    await account('guessed@example.test');
    const start = Date.now();
    vi.useFakeTimers({ toFake: ['Date'], now: start });
    for (let i = 0; i < 5; i++) {
      await new Client(`10.44.0.${i}`).call(signIn.POST, {
        json: { email: 'guessed@example.test', password: 'wrong-guess' },
      });
    }
    const soon = await new Client('10.45.0.1').call(signIn.POST, { json: { email: 'guessed@example.test', password } });
    expect(soon.status).toBe(429);
    expect(Number(soon.headers.get('retry-after'))).toBeLessThanOrEqual(60);
    // A minute later, well inside the old 15-minute lock, the owner's right password works.
    vi.setSystemTime(start + 61_000);
    const owner = await new Client('10.45.0.1').call(signIn.POST, {
      json: { email: 'guessed@example.test', password },
    });
    expect(owner.status).toBe(200);
  });

  it('counts in the database, where every server process sees the same tries', async () => {
    await new Client('10.46.0.1').call(signIn.POST, {
      json: { email: 'nobody@example.test', password: 'wrong-guess' },
    });
    const row = await SignInThrottle.findByPk('email:nobody@example.test');
    expect(row?.failures).toBe(1);
  });
});

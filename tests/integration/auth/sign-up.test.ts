import { SMTPServer } from 'smtp-server';
import { afterEach, describe, expect, it, vi } from 'vitest';
import * as confirm from '@/app/api/auth/sign-up/confirm/route';
import * as resend from '@/app/api/auth/sign-up/resend/route';
import * as signUp from '@/app/api/auth/sign-up/route';
import * as signIn from '@/app/api/auth/sign-in/route';
import * as me from '@/app/api/me/route';
import { mailQueueDrained } from '@/lib/mail/send';
import { Membership, PendingSignUp, Team, User } from '@/models';
import { Client, signUpConfirmed, signUpToken, useTestApp } from '../../helpers/app';

// Sign-up must not tell who has an account (docs/api/README.md, "Accounts and teams").
const app = useTestApp();
const password = 'sign-up-password-1';
const form = (email: string) => ({ name: 'Ines Crag', email, password, teamName: `Crag ${email}` });

/** Status, content type and the exact bytes of the body, as an attacker would compare them. */
async function rawSignUp(
  json: unknown,
): Promise<{ status: number; type: string | null; body: string; cookie: string[] }> {
  const res = await signUp.POST(
    new Request('http://app.test/api/auth/sign-up', {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-forwarded-for': '10.5.0.1' },
      body: JSON.stringify(json),
    }),
  );
  return {
    status: res.status,
    type: res.headers.get('content-type'),
    body: await res.text(),
    cookie: res.headers.getSetCookie(),
  };
}

/** A relay that refuses every recipient, as a broken or strict mail provider would. */
async function refusingRelay(): Promise<{ port: number; refused: () => number; close: () => Promise<void> }> {
  let refused = 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onRcptTo(_address, _session, callback) {
      refused++;
      callback(Object.assign(new Error('Mailbox unavailable'), { responseCode: 550 }));
    },
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const address = server.server.address();
  return {
    port: typeof address === 'object' && address ? address.port : 0,
    refused: () => refused,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

afterEach(() => {
  vi.restoreAllMocks();
  process.env.SMTP_PORT = String(app.smtp().port);
});

describe('sign-up answers the same for every address', () => {
  it('a taken and a new address get byte-identical status and body, and no session', async () => {
    expect((await signUpConfirmed(new Client(), form('taken@example.test'))).status).toBe(201);
    const taken = await rawSignUp(form('taken@example.test'));
    const fresh = await rawSignUp(form('fresh@example.test'));
    expect(taken).toEqual(fresh);
    expect(fresh.status).toBe(202);
    expect(JSON.parse(fresh.body)).toEqual({ status: 'check-your-mail' });
    expect(fresh.cookie).toEqual([]);
    await mailQueueDrained();
    // What differs is the mail, which only the owner of the address reads.
    const tookMail = app.smtp().messages.filter((m) => m.to.includes('taken@example.test'));
    expect(tookMail.at(-1)!.subject).toBe('You already have a Loadbearing account');
    expect(tookMail.at(-1)!.text).toContain('http://app.test/reset-password');
    expect(
      app
        .smtp()
        .messages.filter((m) => m.to.includes('fresh@example.test'))
        .at(-1)!.subject,
    ).toBe('Confirm your Loadbearing account');
    // Nothing was created for the taken address: one user, no waiting sign-up.
    expect(await User.count({ where: { email: 'taken@example.test' } })).toBe(1);
    expect(await PendingSignUp.count({ where: { email: 'taken@example.test', usedAt: null } })).toBe(0);
  });

  it('a relay that refuses the mail changes nothing in the answer, for a taken or a new address', async () => {
    expect((await signUpConfirmed(new Client(), form('refused-taken@example.test'))).status).toBe(201);
    const healthy = await rawSignUp(form('healthy@example.test'));
    await mailQueueDrained();
    const relay = await refusingRelay();
    vi.spyOn(console, 'error').mockImplementation(() => {});
    try {
      process.env.SMTP_PORT = String(relay.port);
      const taken = await rawSignUp(form('refused-taken@example.test'));
      const fresh = await rawSignUp(form('refused-new@example.test'));
      await mailQueueDrained();
      expect(relay.refused()).toBe(2);
      expect(taken).toEqual(healthy);
      expect(fresh).toEqual(healthy);
    } finally {
      await relay.close();
    }
  });

  it('an invalid address is refused with 400 before anything is looked up', async () => {
    const res = await rawSignUp({ ...form('not-an-address'), email: 'not-an-address' });
    expect(res.status).toBe(400);
  });
});

describe('the mailed link creates the account', () => {
  it('creates the user and the team (owner) in one step and signs in; the password works', async () => {
    const before = app.smtp().messages.length;
    expect((await new Client().call(signUp.POST, { json: form('Newbie@Example.test') })).status).toBe(202);
    expect(await User.count({ where: { email: 'newbie@example.test' } })).toBe(0);
    const token = await signUpToken(app.smtp(), 'newbie@example.test', before);
    const client = new Client();
    const res = await client.call(confirm.POST, { json: { token } });
    expect(res.status).toBe(201);
    expect(res.body.user).toEqual({ id: expect.any(Number), name: 'Ines Crag', email: 'newbie@example.test' });
    expect(res.body.team.name).toBe('Crag Newbie@Example.test');
    const membership = await Membership.findOne({ where: { userId: res.body.user.id, teamId: res.body.team.id } });
    expect(membership?.role).toBe('owner');
    expect((await client.call(me.GET)).status).toBe(200);
    const signedIn = await new Client('10.5.1.1').call(signIn.POST, {
      json: { email: 'newbie@example.test', password },
    });
    expect(signedIn.status).toBe(200);
  });

  it('two clicks at once: one account, one 201 and one 409', async () => {
    const before = app.smtp().messages.length;
    await new Client().call(signUp.POST, { json: form('double@example.test') });
    const token = await signUpToken(app.smtp(), 'double@example.test', before);
    const [a, b] = await Promise.all([
      new Client().call(confirm.POST, { json: { token } }),
      new Client().call(confirm.POST, { json: { token } }),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    expect((a.status === 409 ? a : b).body.error).toMatch(/already used/);
    expect(await User.count({ where: { email: 'double@example.test' } })).toBe(1);
    expect(await Team.count({ where: { name: 'Crag double@example.test' } })).toBe(1);
    // Later clicks are told the same.
    expect((await new Client().call(confirm.POST, { json: { token } })).status).toBe(409);
  });

  it('an expired link or an unknown one is refused and creates nothing', async () => {
    const before = app.smtp().messages.length;
    await new Client().call(signUp.POST, { json: form('late@example.test') });
    const token = await signUpToken(app.smtp(), 'late@example.test', before);
    await PendingSignUp.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email: 'late@example.test' } });
    const expired = await new Client().call(confirm.POST, { json: { token } });
    expect(expired.status).toBe(400);
    expect(expired.body.error).toMatch(/expired/);
    const unknown = await new Client().call(confirm.POST, { json: { token: 'x'.repeat(43) } });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error).toMatch(/not valid/);
    expect(await User.count({ where: { email: 'late@example.test' } })).toBe(0);
  });

  it('"send it again" mails a new link; the earlier one stops working; the answer is the same for anyone', async () => {
    const before = app.smtp().messages.length;
    await new Client().call(signUp.POST, { json: form('again@example.test') });
    const first = await signUpToken(app.smtp(), 'again@example.test', before);
    const middle = app.smtp().messages.length;
    const waiting = await new Client().call(resend.POST, { json: { email: 'again@example.test' } });
    const nobody = await new Client().call(resend.POST, { json: { email: 'nobody-at-all@example.test' } });
    expect(waiting).toEqual(expect.objectContaining({ status: 202, body: { status: 'check-your-mail' } }));
    expect(nobody.status).toBe(waiting.status);
    expect(nobody.body).toEqual(waiting.body);
    const second = await signUpToken(app.smtp(), 'again@example.test', middle);
    expect(second).not.toBe(first);
    expect((await new Client().call(confirm.POST, { json: { token: first } })).status).toBe(400);
    expect((await new Client().call(confirm.POST, { json: { token: second } })).status).toBe(201);
  });
});

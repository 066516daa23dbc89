import { describe, expect, it } from 'vitest';
import * as me from '@/app/api/me/route';
import * as signIn from '@/app/api/auth/sign-in/route';
import * as signOut from '@/app/api/auth/sign-out/route';
import * as signUp from '@/app/api/auth/sign-up/route';
import { mailQueueDrained } from '@/lib/mail/send';
import { PendingSignUp, User } from '@/models';
import { Client, useTestApp, signUpConfirmed } from '../../helpers/app';

useTestApp();

const account = { name: 'Ada Rook', email: 'Ada@Example.test', password: 'correct-horse-9', teamName: 'Rook Strength' };

describe('sign-up, sign-in, sign-out', () => {
  it('signs up, creates the team with the user as owner, and signs in', async () => {
    const client = new Client();
    const res = await signUpConfirmed(client, account);
    expect(res.status).toBe(201);
    expect(res.body.user).toEqual({ id: expect.any(Number), name: 'Ada Rook', email: 'ada@example.test' });
    expect(res.body.team.slug).toBe('rook-strength');
    expect(client.cookie).toMatch(/^loadbearing_session=/);
    const setCookie = res.headers.get('set-cookie')!;
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);

    const who = await client.call(me.GET);
    expect(who.status).toBe(200);
    expect(who.body.teams).toEqual([expect.objectContaining({ name: 'Rook Strength', role: 'owner', memberCount: 1 })]);
    expect(JSON.stringify(who.body)).not.toMatch(/passwordHash|\$2[aby]\$/);
  });

  it('makes no second account with the same e-mail (any case): the same 202, and the mail says sign in', async () => {
    const before = await User.count();
    const res = await new Client().call(signUp.POST, { json: { ...account, email: 'ADA@example.test' } });
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ status: 'check-your-mail' });
    await mailQueueDrained();
    expect(await User.count()).toBe(before);
    expect(await PendingSignUp.count({ where: { email: 'ada@example.test', usedAt: null } })).toBe(0);
  });

  it('signs out and then /api/me is 401', async () => {
    const client = new Client();
    expect((await client.call(signIn.POST, { json: { email: account.email, password: account.password } })).status).toBe(200);
    expect((await client.call(me.GET)).status).toBe(200);
    expect((await client.call(signOut.POST, { method: 'POST' })).status).toBe(200);
    expect(client.cookie).toBe('');
    const after = await client.call(me.GET);
    expect(after.status).toBe(401);
    expect(after.body).toEqual({ error: expect.any(String) });
  });

  it('gives the same answer for a wrong password and an unknown e-mail', async () => {
    const wrong = await new Client('10.0.0.2').call(signIn.POST, { json: { email: account.email, password: 'nope-nope-nope' } });
    const unknown = await new Client('10.0.0.3').call(signIn.POST, { json: { email: 'nobody@example.test', password: 'nope-nope-nope' } });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error).toBe(unknown.body.error);
  });

  it('rate-limits per e-mail: the 6th attempt after 5 failures is 429 with Retry-After, even with the right password', async () => {
    const email = 'limit@example.test';
    await signUpConfirmed(new Client(), { ...account, email });
    for (let i = 0; i < 5; i++) {
      // Each try from a different address, so only the per-e-mail counter can trip.
      const res = await new Client(`10.1.0.${i}`).call(signIn.POST, { json: { email, password: 'wrong-password' } });
      expect(res.status, `attempt ${i + 1}`).toBe(i < 4 ? 401 : 429);
    }
    const blocked = await new Client('10.1.1.1').call(signIn.POST, { json: { email, password: account.password } });
    expect(blocked.status).toBe(429);
    const retryAfter = Number(blocked.headers.get('retry-after'));
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(15 * 60);
  });

  it('rate-limits per address across different e-mails', async () => {
    const client = new Client('10.9.9.9');
    for (let i = 0; i < 5; i++) await client.call(signIn.POST, { json: { email: `x${i}@example.test`, password: 'wrong-password' } });
    const res = await client.call(signIn.POST, { json: { email: account.email, password: account.password } });
    expect(res.status).toBe(429);
  });
});

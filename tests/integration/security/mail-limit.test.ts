import { describe, expect, it } from 'vitest';
import * as reset from '@/app/api/auth/password-reset/route';
import * as signUp from '@/app/api/auth/sign-up/route';
import * as resend from '@/app/api/auth/sign-up/resend/route';
import { PER_ADDRESS, PER_RECIPIENT } from '@/lib/auth/mail-limit';
import { mailQueueDrained } from '@/lib/mail/send';
import { Client, signUpConfirmed, useTestApp } from '../../helpers/app';

// Mails anyone can make the app send without signing in (lib/auth/mail-limit.ts): one client
// address cannot ask for more than PER_ADDRESS in an hour, and one inbox receives at most
// PER_RECIPIENT of them, from however many addresses — without the answer telling who has an
// account.

const app = useTestApp();
const person = (n: number) => ({
  name: `Person ${n}`,
  email: `person-${n}@mail-limit.test`,
  password: 'a-long-enough-password',
  teamName: `Team ${n}`,
});

describe('mail requests without signing in', () => {
  it('one client address gets 429 with Retry-After after its share, whatever it asks for', async () => {
    const client = new Client('10.66.0.1');
    const statuses: number[] = [];
    for (let i = 0; i < PER_ADDRESS; i++) {
      const handler = [signUp.POST, resend.POST, reset.POST][i % 3];
      const json = i % 3 === 0 ? person(i) : { email: person(i).email };
      statuses.push((await client.call(handler, { json })).status);
    }
    expect(statuses).toEqual(Array(PER_ADDRESS).fill(202));
    const limited = await client.call(signUp.POST, { json: person(100) });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(limited.body.error).toMatch(/Too many e-mails/);
    // A reset for an address with an account is refused the same way: nothing to tell them apart.
    expect((await client.call(reset.POST, { json: { email: 'owner@granite-hollow.test' } })).status).toBe(429);
    // Another client address is not affected.
    expect((await new Client('10.66.0.2').call(signUp.POST, { json: person(101) })).status).toBe(202);
  });

  it('one inbox receives at most its share, while every request is answered the same', async () => {
    const victim = 'inbox@mail-limit.test';
    await signUpConfirmed(new Client('10.66.1.1'), { ...person(200), email: victim });
    await mailQueueDrained();
    const before = app.smtp().messages.filter((m) => m.to.includes(victim)).length;
    const statuses: number[] = [];
    for (let i = 0; i < PER_RECIPIENT + 3; i++) {
      statuses.push((await new Client(`10.66.2.${i + 1}`).call(reset.POST, { json: { email: victim } })).status);
    }
    await mailQueueDrained();
    expect(statuses).toEqual(Array(PER_RECIPIENT + 3).fill(202));
    const received = app.smtp().messages.filter((m) => m.to.includes(victim)).length - before;
    // The sign-up above took one of the inbox's mails (its confirmation link).
    expect(received).toBe(PER_RECIPIENT - 1);
  });
});

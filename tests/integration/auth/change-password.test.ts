import { describe, expect, it } from 'vitest';
import * as changePassword from '@/app/api/auth/password/route';
import * as signIn from '@/app/api/auth/sign-in/route';
import * as me from '@/app/api/me/route';
import { resetRateLimits } from '@/lib/auth/rate-limit';
import { Client, signUpConfirmed, useTestApp } from '../../helpers/app';

// A signed-in person changes their password (docs/api/README.md, "Accounts and teams").
useTestApp();
const email = 'changer@example.test';
const oldPassword = 'old-password-one-1';
const newPassword = 'new-password-two-2';

describe('changing the password', () => {
  it('ends every other session, keeps this one, and only the new password signs in', async () => {
    const here = new Client('10.8.0.1');
    expect(
      (await signUpConfirmed(here, { name: 'Cora Changer', email, password: oldPassword, teamName: 'Change Lab' }))
        .status,
    ).toBe(201);
    const elsewhere = new Client('10.8.0.2');
    expect((await elsewhere.call(signIn.POST, { json: { email, password: oldPassword } })).status).toBe(200);
    expect((await elsewhere.call(me.GET)).status).toBe(200);

    const res = await here.call(changePassword.POST, { json: { currentPassword: oldPassword, newPassword } });
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(email);

    expect((await elsewhere.call(me.GET)).status).toBe(401);
    expect((await here.call(me.GET)).status).toBe(200);
    expect((await new Client('10.8.0.3').call(signIn.POST, { json: { email, password: oldPassword } })).status).toBe(
      401,
    );
    expect((await new Client('10.8.0.4').call(signIn.POST, { json: { email, password: newPassword } })).status).toBe(
      200,
    );
  });

  it('a wrong current password changes nothing and counts like a failed sign-in', async () => {
    const here = new Client('10.8.1.1');
    expect((await here.call(signIn.POST, { json: { email, password: newPassword } })).status).toBe(200);
    const wrong = await here.call(changePassword.POST, {
      json: { currentPassword: 'not-it-at-all', newPassword: 'third-password-3' },
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.issues).toEqual([{ path: 'currentPassword', message: expect.any(String) }]);
    expect((await here.call(me.GET)).status).toBe(200);
    for (let i = 0; i < 4; i++) {
      await here.call(changePassword.POST, {
        json: { currentPassword: `guess-${i}-wrong`, newPassword: 'third-password-3' },
      });
    }
    const limited = await here.call(changePassword.POST, {
      json: { currentPassword: newPassword, newPassword: 'third-password-3' },
    });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
  });

  it('needs a session, and a new password that differs from the current one', async () => {
    await resetRateLimits();
    const anonymous = await new Client().call(changePassword.POST, {
      json: { currentPassword: newPassword, newPassword: 'whatever-pass-9' },
    });
    expect(anonymous.status).toBe(401);
    const here = new Client('10.8.2.1');
    expect((await here.call(signIn.POST, { json: { email, password: newPassword } })).status).toBe(200);
    const same = await here.call(changePassword.POST, { json: { currentPassword: newPassword, newPassword } });
    expect(same.status).toBe(400);
    expect(same.body.issues[0].path).toBe('newPassword');
  });
});

import { describe, expect, it } from 'vitest';
import * as reset from '@/app/api/auth/password-reset/route';
import * as confirm from '@/app/api/auth/password-reset/confirm/route';
import * as signIn from '@/app/api/auth/sign-in/route';
import { PasswordResetToken } from '@/models';
import { Client, linkIn, useTestApp, signUpConfirmed } from '../../helpers/app';

const app = useTestApp();
const email = 'reset@example.test';

describe('password reset by e-mailed token', () => {
  it('mails a link with text and HTML parts; the token sets a new password once', async () => {
    await signUpConfirmed(new Client(), { name: 'Reset Me', email, password: 'old-password-1', teamName: 'Reset Team' });
    const res = await new Client().call(reset.POST, { json: { email } });
    expect(res.status).toBe(202);

    const mail = await app.smtp().waitFor((m) => m.to.includes(email) && /Reset/.test(m.subject));
    expect(mail.html).toContain('<a href="http://app.test/reset-password?token=');
    const link = linkIn(mail.text, 'http://app.test/reset-password?token=');
    const token = decodeURIComponent(new URL(link).searchParams.get('token')!);

    const ok = await new Client().call(confirm.POST, { json: { token, password: 'new-password-2' } });
    expect(ok.status).toBe(200);
    expect((await new Client('10.2.0.1').call(signIn.POST, { json: { email, password: 'new-password-2' } })).status).toBe(200);
    expect((await new Client('10.2.0.2').call(signIn.POST, { json: { email, password: 'old-password-1' } })).status).toBe(401);

    const again = await new Client().call(confirm.POST, { json: { token, password: 'third-password-3' } });
    expect(again.status).toBe(400);
    expect(again.body.issues).toEqual([{ path: 'token', message: expect.any(String) }]);
  });

  it('answers 202 for an unknown address and sends nothing', async () => {
    const before = app.smtp().messages.length;
    const res = await new Client().call(reset.POST, { json: { email: 'stranger@example.test' } });
    expect(res.status).toBe(202);
    await new Promise((r) => setTimeout(r, 200));
    expect(app.smtp().messages.length).toBe(before);
  });

  it('rejects a token older than one hour', async () => {
    const before = app.smtp().messages.length;
    await new Client().call(reset.POST, { json: { email } });
    const mail = await app.smtp().waitFor((m) => m.to.includes(email) && app.smtp().messages.indexOf(m) >= before);
    const token = decodeURIComponent(new URL(linkIn(mail.text, 'http://app.test/reset-password?token=')).searchParams.get('token')!);
    await PasswordResetToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { usedAt: null } });
    const res = await new Client().call(confirm.POST, { json: { token, password: 'another-password-4' } });
    expect(res.status).toBe(400);
  });
});

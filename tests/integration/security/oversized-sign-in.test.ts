import { beforeAll, describe, expect, it } from 'vitest';
import * as signIn from '@/app/api/auth/sign-in/route';
import { db } from '@/lib/db';
import { Client, signUpConfirmed, useTestApp } from '../../helpers/app';

// A sign-in whose password is longer than any password an account can have (the 200 characters
// of sign-up and reset) is bad input: 400, nothing changed (docs/api/README.md, "Errors") — not a
// failed try that takes a row of the throttle and runs the hash over a megabyte.
useTestApp();

beforeAll(async () => {
  const res = await signUpConfirmed(new Client(), {
    name: 'Long Word',
    email: 'long@example.test',
    password: 'valid-password-1',
    teamName: 'Lengths',
  });
  expect(res.status).toBe(201);
});

async function throttleRows(): Promise<number> {
  const [[row]] = (await db().query('SELECT COUNT(*) AS n FROM sign_in_throttles')) as [{ n: number }[], unknown];
  return row.n;
}

describe('an oversized password at sign-in', () => {
  it('is a 400 that counts no failed try', async () => {
    const before = await throttleRows();
    const res = await new Client('10.9.9.9').call(signIn.POST, {
      json: { email: 'long@example.test', password: 'x'.repeat(1_000_001) },
    });
    expect(res.status).toBe(400);
    expect(res.body.issues[0].path).toBe('password');
    expect(await throttleRows()).toBe(before);
  });

  it('leaves a password of the longest allowed length to the check', async () => {
    const res = await new Client('10.9.9.8').call(signIn.POST, {
      json: { email: 'long@example.test', password: 'y'.repeat(200) },
    });
    expect(res.status).toBe(401);
  });
});

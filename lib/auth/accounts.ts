import { Op } from 'sequelize';
import { AppError, badRequest } from '@/lib/api/errors';
import { db } from '@/lib/db';
import { env } from '@/lib/env';
import { passwordResetMail } from '@/lib/mail/templates';
import { sendMailLater } from '@/lib/mail/send';
import { PasswordResetToken, User } from '@/models';
import { mayMailRecipient, takeMailRequest } from './mail-limit';
import { checkPassword, DUMMY_HASH, hashPassword } from './password';
import { assertNotLimitedAfter, clearFailures, succeeded, takeTry } from './rate-limit';
import { endSessions } from './sessions';
import { hashToken, newToken } from './tokens';

export const RESET_TTL_MS = 60 * 60 * 1000;

export interface PublicUser {
  id: number;
  name: string;
  email: string;
}

const publicUser = (u: User): PublicUser => ({ id: u.id, name: u.name, email: u.email });

/** Checks e-mail and password under the sign-in rate limit; the same message for either mistake. */
export async function authenticate(input: { email: string; password: string }, address: string): Promise<PublicUser> {
  const counts = await takeTry(input.email, address);
  const user = await User.scope('withPassword').findOne({ where: { email: input.email } });
  const ok = await checkPassword(input.password, user?.passwordHash ?? DUMMY_HASH);
  if (!user || !ok) {
    assertNotLimitedAfter(counts);
    throw new AppError('unauthorized', 'That e-mail and password do not match an account.');
  }
  await succeeded(input.email, address);
  return publicUser(user);
}

/**
 * Mails a single-use reset link. Answers the same whether or not the address has an account,
 * so the form cannot be used to find out who is registered: the mail goes out after the answer
 * (its time and a relay's failure never show in it).
 */
export async function requestPasswordReset(email: string, address: string): Promise<void> {
  await takeMailRequest(address);
  // Counted for known and unknown addresses alike, so the answer's time tells nothing either.
  if (!(await mayMailRecipient(email))) return;
  const user = await User.findOne({ where: { email } });
  if (!user) return;
  const { token, hash } = newToken();
  await PasswordResetToken.create({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + RESET_TTL_MS) });
  const url = `${env().APP_URL}/reset-password?token=${encodeURIComponent(token)}`;
  sendMailLater(passwordResetMail({ to: user.email, name: user.name, url }));
}

/** Sets the new password if the token is known, unused and under an hour old; the token is then spent. */
export async function confirmPasswordReset(token: string, password: string): Promise<PublicUser> {
  const record = await PasswordResetToken.findOne({
    where: { tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
  });
  if (!record) throw expiredLink();
  const passwordHash = await hashPassword(password);
  const user = await db().transaction(async (transaction) => {
    // Spent in one conditional UPDATE: of concurrent confirms with one link, exactly one wins.
    const [spent] = await PasswordResetToken.update(
      { usedAt: new Date() },
      { where: { id: record.id, usedAt: null }, transaction },
    );
    if (!spent) throw expiredLink();
    // Spend every outstanding link of this person, not just this one.
    await PasswordResetToken.update(
      { usedAt: new Date() },
      { where: { userId: record.userId, usedAt: null }, transaction },
    );
    await User.update({ passwordHash }, { where: { id: record.userId }, transaction });
    // A new password ends every session, a stolen cookie's included.
    await endSessions(record.userId, transaction);
    return (await User.findByPk(record.userId, { transaction }))!;
  });
  await clearFailures(user.email);
  return publicUser(user);
}

const expiredLink = () =>
  badRequest('This reset link has expired or was already used. Ask for a new one.', [
    { path: 'token', message: 'Expired or used.' },
  ]);

export async function findUser(userId: number): Promise<PublicUser | null> {
  const user = await User.findByPk(userId);
  return user ? publicUser(user) : null;
}

/**
 * A signed-in person changes their password: the current one is checked under the sign-in rate
 * limit (lib/auth/rate-limit.ts; a stolen session cannot guess it faster than sign-in could), the
 * new one is stored, and every session of the person ends (docs/architecture.md, sessions). The
 * caller starts a fresh session for the browser that made the change.
 */
export async function changePassword(
  userId: number,
  input: { currentPassword: string; newPassword: string },
  address: string,
): Promise<PublicUser> {
  const user = await User.scope('withPassword').findByPk(userId);
  if (!user) throw new AppError('unauthorized', 'Sign in to continue.');
  const counts = await takeTry(user.email, address);
  if (!(await checkPassword(input.currentPassword, user.passwordHash))) {
    assertNotLimitedAfter(counts);
    throw badRequest('Your current password is not right.', [
      { path: 'currentPassword', message: 'This is not your current password.' },
    ]);
  }
  await succeeded(user.email, address);
  const passwordHash = await hashPassword(input.newPassword);
  await db().transaction(async (transaction) => {
    await User.update({ passwordHash }, { where: { id: userId }, transaction });
    await endSessions(userId, transaction);
  });
  return publicUser(user);
}

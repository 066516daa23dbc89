import { Op } from 'sequelize';
import { AppError, badRequest, conflict } from '@/lib/api/errors';
import { recordEvent } from '@/lib/audit/record';
import { env } from '@/lib/env';
import { composeMailLater } from '@/lib/mail/send';
import { accountExistsMail, confirmSignUpMail } from '@/lib/mail/templates';
import { writeTransaction } from '@/lib/reviews/transaction';
import { createTeam } from '@/lib/teams/teams';
import { PendingSignUp, User } from '@/models';
import type { PublicUser } from './accounts';
import { mayMailRecipient, takeMailRequest } from './mail-limit';
import { hashPassword } from './password';
import { hashToken, newToken } from './tokens';

/** How long a sign-up link works. */
export const SIGN_UP_TTL_MS = 24 * 60 * 60 * 1000;

export interface SignUpInput {
  name: string;
  email: string;
  password: string;
  teamName: string;
}

/**
 * Sign-up confirmed by e-mail (docs/api/README.md, "Accounts and teams"). The answer is the same
 * for every address and takes the same work (hashing the password); whether the address already
 * has an account is looked up after the answer, with the mail: a new address gets a link that
 * creates the account, a taken one a note to sign in or reset the password. Neither the lookup,
 * the write, the relay's time nor its failure can show in the answer — so sign-up cannot be used
 * to find out who has an account (OWASP Authentication Cheat Sheet, "Authentication and Error
 * Messages"). Each request takes one of the client address's mail requests (429 past its share)
 * and each mail one of the inbox's (lib/auth/mail-limit.ts).
 */
export async function requestSignUp(input: SignUpInput, address: string): Promise<void> {
  await takeMailRequest(address);
  const passwordHash = await hashPassword(input.password);
  composeMailLater(() => signUpMail({ ...input, passwordHash }));
}

/** To a taken address: the note that an account exists, with the ways in — never a second account. */
function accountExistsFor(user: User) {
  const appUrl = env().APP_URL;
  return accountExistsMail({
    to: user.email,
    name: user.name,
    signInUrl: `${appUrl}/sign-in`,
    resetUrl: `${appUrl}/reset-password`,
  });
}

async function signUpMail(input: Omit<SignUpInput, 'password'> & { passwordHash: string }) {
  if (!(await mayMailRecipient(input.email))) return null;
  const user = await User.findOne({ where: { email: input.email } });
  if (user) return accountExistsFor(user);
  const { token, hash } = newToken();
  await PendingSignUp.create({
    email: input.email,
    name: input.name,
    teamName: input.teamName,
    passwordHash: input.passwordHash,
    tokenHash: hash,
    expiresAt: new Date(Date.now() + SIGN_UP_TTL_MS),
  });
  return confirmSignUpMail({ to: input.email, name: input.name, teamName: input.teamName, url: confirmUrl(token) });
}

/**
 * "Send it again": a new link for the latest waiting sign-up of this address (the earlier link
 * stops working), the account note again for a taken address, nothing for an unknown one. The
 * answer is the same in every case, for the same reason as requestSignUp.
 */
export async function resendSignUp(email: string, address: string): Promise<void> {
  await takeMailRequest(address);
  composeMailLater(async () => {
    if (!(await mayMailRecipient(email))) return null;
    const user = await User.findOne({ where: { email } });
    if (user) return accountExistsFor(user);
    const pending = await PendingSignUp.findOne({
      where: { email, usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      order: [['id', 'DESC']],
    });
    if (!pending) return null;
    const { token, hash } = newToken();
    const [renewed] = await PendingSignUp.update(
      { tokenHash: hash, expiresAt: new Date(Date.now() + SIGN_UP_TTL_MS) },
      { where: { id: pending.id, usedAt: null } },
    );
    if (!renewed) return null;
    return confirmSignUpMail({ to: email, name: pending.name, teamName: pending.teamName, url: confirmUrl(token) });
  });
}

const confirmUrl = (token: string) => `${env().APP_URL}/sign-up/confirm?token=${encodeURIComponent(token)}`;

export type SignUpLinkState =
  | { state: 'ready'; name: string; email: string; teamName: string }
  | { state: 'used' }
  | { state: 'expired' }
  | { state: 'unknown' };

/** What the confirm page shows before the click (a read: opening the link changes nothing). */
export async function signUpLinkState(token: string): Promise<SignUpLinkState> {
  const record = await PendingSignUp.findOne({ where: { tokenHash: hashToken(token) } });
  if (!record) return { state: 'unknown' };
  if (record.usedAt) return { state: 'used' };
  if (record.expiresAt.getTime() <= Date.now()) return { state: 'expired' };
  return { state: 'ready', name: record.name, email: record.email, teamName: record.teamName };
}

export const USED_LINK = 'This link was already used: your account exists. Sign in with your e-mail and password.';
const unknownLink = () =>
  badRequest('This sign-up link is not valid. Copy the whole link from the mail, or sign up again.', [
    { path: 'token', message: 'Unknown link.' },
  ]);
const expiredLink = () =>
  badRequest('This sign-up link has expired (links work for 24 hours). Sign up again to get a new one.', [
    { path: 'token', message: 'Expired.' },
  ]);

/**
 * Creates the account and its team (the new user as owner) from a mailed link, in one write
 * transaction. The link is spent by a conditional UPDATE inside it, so of two clicks exactly one
 * creates the account and the other gets 409 (docs/architecture.md: check-then-write rules).
 */
export async function confirmSignUp(
  token: string,
): Promise<{ user: PublicUser; team: { id: number; name: string; slug: string } }> {
  const record = await PendingSignUp.findOne({ where: { tokenHash: hashToken(token) } });
  if (!record) throw unknownLink();
  if (record.usedAt) throw conflict(USED_LINK);
  if (record.expiresAt.getTime() <= Date.now()) throw expiredLink();
  return writeTransaction(async (transaction) => {
    const [spent] = await PendingSignUp.update(
      { usedAt: new Date() },
      { where: { id: record.id, usedAt: null }, transaction },
    );
    if (!spent) throw conflict(USED_LINK);
    if (await User.count({ where: { email: record.email }, transaction })) {
      // Another sign-up link of the same address (or an invitation) made the account first.
      throw new AppError('conflict', 'An account with this e-mail already exists. Sign in, or reset the password.');
    }
    const user = await User.create(
      { name: record.name, email: record.email, passwordHash: record.passwordHash },
      { transaction },
    );
    // The address's other waiting links are spent with this one.
    await PendingSignUp.update({ usedAt: new Date() }, { where: { email: record.email, usedAt: null }, transaction });
    const team = await createTeam(record.teamName, user.id, transaction);
    await recordEvent(
      { teamId: team.id, actorId: user.id, action: 'team.created', subjectType: 'team', subjectId: team.id },
      transaction,
    );
    return {
      user: { id: user.id, name: user.name, email: user.email },
      team: { id: team.id, name: team.name, slug: team.slug },
    };
  });
}

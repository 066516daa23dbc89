import { badRequest, conflict, notFound } from '@/lib/api/errors';
import { recordEvent } from '@/lib/audit/record';
import { hashPassword } from '@/lib/auth/password';
import { hashToken, newToken } from '@/lib/auth/tokens';
import { db } from '@/lib/db';
import { env } from '@/lib/env';
import { sendMail } from '@/lib/mail/send';
import { invitationMail } from '@/lib/mail/templates';
import { Invitation, Membership, Team, User } from '@/models';
import type { Role } from '@/models/roles';
import { assertNotMember } from './members';

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

/** Creates an invitation and mails its link; a newer invitation to the same address replaces older ones. */
export async function inviteMember(inviterId: number, teamId: number, input: { email: string; role: Role }) {
  await assertNotMember(teamId, input.email);
  const team = await Team.findByPk(teamId);
  const inviter = await User.findByPk(inviterId);
  if (!team || !inviter) throw notFound('That team');
  const { token, hash } = newToken();
  const invitation = await db().transaction(async (transaction) => {
    await Invitation.destroy({ where: { teamId, email: input.email, acceptedAt: null }, transaction });
    const created = await Invitation.create(
      {
        teamId,
        email: input.email,
        role: input.role,
        tokenHash: hash,
        invitedById: inviterId,
        expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
      },
      { transaction },
    );
    await recordEvent(
      {
        teamId,
        actorId: inviterId,
        action: 'member.invited',
        subjectType: 'invitation',
        subjectId: created.id,
        data: { email: input.email, role: input.role },
      },
      transaction,
    );
    return created;
  });
  const url = `${env().APP_URL}/invitations/${encodeURIComponent(token)}`;
  await sendMail(
    invitationMail({ to: input.email, teamName: team.name, inviterName: inviter.name, role: input.role, url }),
  );
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    expiresAt: invitation.expiresAt.toISOString(),
  };
}

export interface InvitationView {
  teamId: number;
  teamName: string;
  email: string;
  role: Role;
  /** Whether an account with the invited e-mail exists already. */
  accountExists: boolean;
}

/**
 * The invitation behind a link that can still be accepted. A link someone has just used is a 409,
 * not a 404: of two people accepting at once, the one who reads after the other's commit is
 * told the same as the one who loses the conditional UPDATE below.
 */
async function openInvitation(token: string): Promise<Invitation> {
  const invitation = await Invitation.findOne({ where: { tokenHash: hashToken(token) } });
  if (invitation?.acceptedAt) throw conflict(USED);
  if (!invitation || invitation.expiresAt.getTime() <= Date.now()) {
    throw notFound('This invitation (it may have expired or been used)');
  }
  return invitation;
}

const USED = 'This invitation was already used. Ask the team for a new one.';

export async function viewInvitation(token: string): Promise<InvitationView> {
  const invitation = await openInvitation(token);
  const team = (await Team.findByPk(invitation.teamId))!;
  const accountExists = (await User.count({ where: { email: invitation.email } })) > 0;
  return { teamId: team.id, teamName: team.name, email: invitation.email, role: invitation.role, accountExists };
}

/**
 * Joins the invited team. A signed-in person joins with their own account, whatever address the
 * mail went to (they proved they can read it); a signed-out one creates an account with the
 * invited address, or is asked to sign in if that account exists.
 */
export async function acceptInvitation(
  token: string,
  who: { userId: number } | { name: string; password: string },
): Promise<{ userId: number; teamId: number }> {
  const invitation = await openInvitation(token);
  // Hashed before the write transaction: the writer's turn is not spent on bcrypt.
  const passwordHash = 'userId' in who ? null : await hashPassword(who.password);
  return db().transaction(async (transaction) => {
    // Spent in one conditional UPDATE: of two accepts at the same moment one wins, the other is told.
    const [spent] = await Invitation.update(
      { acceptedAt: new Date() },
      { where: { id: invitation.id, acceptedAt: null }, transaction },
    );
    if (!spent) throw conflict(USED);
    let userId: number;
    if ('userId' in who) {
      userId = who.userId;
    } else {
      if (await User.count({ where: { email: invitation.email }, transaction })) {
        throw conflict('An account with this e-mail exists already. Sign in, then open the link again.');
      }
      const user = await User.create(
        { name: who.name, email: invitation.email, passwordHash: passwordHash! },
        { transaction },
      );
      userId = user.id;
    }
    if (await Membership.count({ where: { teamId: invitation.teamId, userId }, transaction })) {
      throw badRequest('You are already in this team.', [{ path: 'token', message: 'Already a member.' }]);
    }
    await Membership.create({ teamId: invitation.teamId, userId, role: invitation.role }, { transaction });
    await recordEvent(
      {
        teamId: invitation.teamId,
        actorId: userId,
        action: 'member.joined',
        subjectType: 'invitation',
        subjectId: invitation.id,
        data: { role: invitation.role },
      },
      transaction,
    );
    return { userId, teamId: invitation.teamId };
  });
}

import { Op, type Transaction } from 'sequelize';
import { badRequest, conflict, notFound } from '@/lib/api/errors';
import { recordEvent } from '@/lib/audit/record';
import { writeTransaction } from '@/lib/reviews/transaction';
import { Invitation, Membership, User } from '@/models';
import type { Role } from '@/models/roles';

export interface MemberRow {
  membershipId: number;
  userId: number;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}

export interface PendingInvitation {
  id: number;
  email: string;
  role: Role;
  expiresAt: string;
}

export async function listMembers(teamId: number): Promise<{ members: MemberRow[]; invitations: PendingInvitation[] }> {
  const memberships = await Membership.findAll({
    where: { teamId },
    include: [{ model: User, as: 'user' }],
    order: [['createdAt', 'ASC']],
  });
  const invitations = await Invitation.findAll({
    where: { teamId, acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
    order: [['createdAt', 'DESC']],
  });
  return {
    members: memberships.map((m) => {
      const user = (m as Membership & { user: User }).user;
      return {
        membershipId: m.id,
        userId: user.id,
        name: user.name,
        email: user.email,
        role: m.role,
        joinedAt: m.createdAt.toISOString(),
      };
    }),
    invitations: invitations.map((i) => ({
      id: i.id,
      email: i.email,
      role: i.role,
      expiresAt: i.expiresAt.toISOString(),
    })),
  };
}

async function membershipOf(teamId: number, membershipId: number, transaction?: Transaction): Promise<Membership> {
  const membership = await Membership.findOne({ where: { id: membershipId, teamId }, transaction });
  if (!membership) throw notFound('That member');
  return membership;
}

/**
 * The last-owner rule, checked inside the write transaction that changes the membership: writes
 * are serialised (lib/sqlite-writer.ts; on PostgreSQL the write lock of lib/reviews/transaction.ts), so two owners demoting each other at once see each
 * other's change and the second one is refused.
 */
async function assertAnotherOwnerRemains(teamId: number, membership: Membership, transaction: Transaction) {
  if (membership.role !== 'owner') return;
  const owners = await Membership.count({ where: { teamId, role: 'owner' }, transaction });
  if (owners <= 1) throw conflict('A team needs at least one owner. Make someone else owner first.');
}

export async function changeRole(
  actorId: number,
  teamId: number,
  membershipId: number,
  role: Role,
): Promise<MemberRow> {
  await writeTransaction(async (transaction) => {
    const membership = await membershipOf(teamId, membershipId, transaction);
    if (membership.role !== role && role !== 'owner') await assertAnotherOwnerRemains(teamId, membership, transaction);
    const from = membership.role;
    await membership.update({ role }, { transaction });
    await recordEvent(
      {
        teamId,
        actorId,
        action: 'member.role_changed',
        subjectType: 'membership',
        subjectId: membership.id,
        data: { from, to: role },
      },
      transaction,
    );
  });
  return (await listMembers(teamId)).members.find((m) => m.membershipId === membershipId)!;
}

export async function removeMember(actorId: number, teamId: number, membershipId: number): Promise<void> {
  await writeTransaction(async (transaction) => {
    const membership = await membershipOf(teamId, membershipId, transaction);
    await assertAnotherOwnerRemains(teamId, membership, transaction);
    await membership.destroy({ transaction });
    await recordEvent(
      {
        teamId,
        actorId,
        action: 'member.removed',
        subjectType: 'membership',
        subjectId: membership.id,
        data: { userId: membership.userId },
      },
      transaction,
    );
  });
}

export async function assertNotMember(teamId: number, email: string): Promise<void> {
  const user = await User.findOne({ where: { email } });
  if (user && (await Membership.count({ where: { teamId, userId: user.id } }))) {
    throw badRequest('That person is already in the team.', [{ path: 'email', message: 'Already a member.' }]);
  }
}

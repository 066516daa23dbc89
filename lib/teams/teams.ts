import type { Transaction } from 'sequelize';
import { Membership, Team } from '@/models';
import type { Role } from '@/models/roles';
import { uniqueSlug } from './slug';

export async function createTeam(name: string, ownerId: number, transaction?: Transaction): Promise<Team> {
  const slug = await uniqueSlug(name, async (s) => (await Team.count({ where: { slug: s }, transaction })) > 0);
  const team = await Team.create({ name, slug }, { transaction });
  await Membership.create({ teamId: team.id, userId: ownerId, role: 'owner' }, { transaction });
  return team;
}

export interface TeamSummary {
  id: number;
  name: string;
  slug: string;
  role: Role;
  memberCount: number;
}

/** The teams a person belongs to, with their role in each. */
export async function teamsOf(userId: number): Promise<TeamSummary[]> {
  const memberships = await Membership.findAll({
    where: { userId },
    include: [{ model: Team, as: 'team' }],
    order: [['createdAt', 'ASC']],
  });
  if (!memberships.length) return [];
  // One grouped count for every team (not one query per team: /api/me runs this on each call).
  const grouped = (await Membership.count({
    where: { teamId: memberships.map((m) => m.teamId) },
    group: ['teamId'],
  })) as unknown as Array<{ teamId: number; count: number | string }>;
  const counts = new Map(grouped.map((row) => [Number(row.teamId), Number(row.count)]));
  return memberships.map((m) => {
    const team = (m as Membership & { team: Team }).team;
    return { id: team.id, name: team.name, slug: team.slug, role: m.role, memberCount: counts.get(m.teamId) ?? 0 };
  });
}

export async function findTeam(teamId: number): Promise<Team | null> {
  return Team.findByPk(teamId);
}

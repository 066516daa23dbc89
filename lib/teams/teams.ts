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
  const counts = await Promise.all(memberships.map((m) => Membership.count({ where: { teamId: m.teamId } })));
  return memberships.map((m, i) => {
    const team = (m as Membership & { team: Team }).team;
    return { id: team.id, name: team.name, slug: team.slug, role: m.role, memberCount: counts[i] };
  });
}

export async function findTeam(teamId: number): Promise<Team | null> {
  return Team.findByPk(teamId);
}

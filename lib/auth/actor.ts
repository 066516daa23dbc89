import { Membership, User } from '@/models';
import type { Actor } from './policy';

/** The signed-in person with their role in each team, or null when the session is stale. */
export async function loadActor(userId: number | undefined): Promise<Actor | null> {
  if (!userId) return null;
  const user = await User.findByPk(userId, { attributes: ['id'] });
  if (!user) return null;
  const memberships = await Membership.findAll({ where: { userId }, attributes: ['teamId', 'role'] });
  return { userId, roles: new Map(memberships.map((m) => [m.teamId, m.role])) };
}

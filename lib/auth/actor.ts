import { Membership, User } from '@/models';
import type { Actor } from './policy';
import type { SessionData } from './session';

/**
 * The signed-in person with their role in each team, or null when the session is stale: the
 * account is gone, or the session began before a sign-out or password reset (lib/auth/sessions.ts).
 */
export async function loadActor(session: SessionData): Promise<Actor | null> {
  const { userId } = session;
  if (!userId) return null;
  const user = await User.findByPk(userId, { attributes: ['id', 'sessionGeneration'] });
  if (!user || user.sessionGeneration !== (session.generation ?? 0)) return null;
  const memberships = await Membership.findAll({ where: { userId }, attributes: ['teamId', 'role'] });
  return { userId, roles: new Map(memberships.map((m) => [m.teamId, m.role])) };
}

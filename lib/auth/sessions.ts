import type { IronSession } from 'iron-session';
import type { Transaction } from 'sequelize';
import { User } from '@/models';
import type { SessionData } from './session';

/**
 * Server-side end of sessions. The cookie is sealed, so it cannot be revoked by itself: it also
 * carries the user's session generation, and a request counts as signed in only while that
 * matches the stored one (lib/auth/actor.ts). Sign-out and a password reset bump it, which ends
 * every session of the person at once, on every device.
 */
export async function startSession(session: IronSession<SessionData>, userId: number): Promise<void> {
  const user = await User.findByPk(userId, { attributes: ['id', 'sessionGeneration'] });
  session.userId = userId;
  session.generation = user?.sessionGeneration ?? 0;
  await session.save();
}

export async function endSessions(userId: number, transaction?: Transaction): Promise<void> {
  await User.increment('sessionGeneration', { by: 1, where: { id: userId }, transaction });
}

/** Sign-out: every session of this person ends, then the cookie goes. */
export async function signOut(session: IronSession<SessionData>): Promise<void> {
  if (session.userId) await endSessions(session.userId);
  session.destroy();
}

import { Follow } from '@/models';

/** The teams a person follows, for the follow buttons' first state. */
export async function followedTeamIds(userId: number): Promise<Set<number>> {
  const rows = await Follow.findAll({ where: { userId }, attributes: ['teamId'] });
  return new Set(rows.map((r) => r.teamId));
}

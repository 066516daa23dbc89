import type { Actor } from '@/lib/auth/policy';
import type { Role } from '@/models/roles';

/** The signed-in actor in a form that crosses from a server page to a client component (no Map). */
export interface ViewerProps {
  userId: number;
  roles: ReadonlyArray<readonly [number, Role]>;
}

export const toViewer = (actor: Actor): ViewerProps => ({ userId: actor.userId, roles: [...actor.roles.entries()] });

/** The team a page shows: ?team=<id> when the person belongs to it, else their first. */
export function pickTeam<T extends { id: number }>(
  teams: readonly T[],
  requested: string | string[] | undefined,
): T | undefined {
  const id = Number(Array.isArray(requested) ? requested[0] : requested);
  return teams.find((t) => t.id === id) ?? teams[0];
}

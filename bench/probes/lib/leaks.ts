import { decide } from '../../../lib/auth/policy';
import type { Answer } from './http';
import type { Endpoint } from './routes';
import { isLink, isTeamScoped } from './routes';
import type { ProbeActor, Team, World } from './world';

/** What the policy says of this actor on this endpoint of this team's rows. */
export type Expectation = 'outside' | 'signed-out' | 'allow' | 'deny' | 'open';

export function expectation(e: Endpoint, who: ProbeActor, team: Team): Expectation {
  if (!who.actor) return 'signed-out';
  if (!who.actor.roles.has(team.teamId)) return isTeamScoped(e) ? 'outside' : 'open';
  if (!e.actions.length) return 'open';
  const userId = who.actor.userId;
  const resource = {
    teamId: team.teamId,
    authorId: team.reviewAuthorId,
    invited: team.invited.has(userId),
    submitted: team.submitted.has(userId),
    coachesMayPublish: team.coachesMayPublish,
  };
  return e.actions.every((a) => decide(who.actor, a, resource) === 'allow') ? 'allow' : 'deny';
}

const REFUSED = new Set([400, 401, 403, 404, 405, 415]);

/**
 * A page whose `notFound()` came after its loading shell was streamed keeps status 200; the
 * payload then carries Next's not-found marker (the same answer as for an id that does not exist).
 */
const STREAMED_NOT_FOUND = 'NEXT_HTTP_ERROR_FALLBACK;404';

export const refused = (answer: Answer) =>
  REFUSED.has(answer.status) ||
  (answer.status >= 300 && answer.status < 400) ||
  answer.text.includes(STREAMED_NOT_FOUND);

/**
 * Why an answer is a leak, or null. Status first (an outsider or a member the policy refuses
 * gets a refusal, never a 2xx), then the body: no team's private words reach anyone outside it,
 * and no unpublished review's title reaches the team's athletes.
 */
export function leakIn(answer: Answer, e: Endpoint, who: ProbeActor, team: Team, world: World, expected: Expectation) {
  // A 409 or a 2xx would mean the request got past the policy to the row.
  if ((expected === 'outside' || expected === 'deny') && !refused(answer))
    return `${answer.status} where the policy refuses`;
  if (expected === 'signed-out' && isTeamScoped(e) && !refused(answer)) return `${answer.status} signed out`;
  const text = answer.text.toLowerCase();
  for (const other of [world.demo, world.other]) {
    if (other === team && isLink(e)) continue;
    const role = who.actor?.roles.get(other.teamId);
    const words = !role ? other.secrets : role === 'athlete' ? other.staffOnly : [];
    const found = words.find((w) => text.includes(w.toLowerCase()));
    if (found) return `shows ${other.name}'s "${found}"`;
  }
  return null;
}

/** A member the policy allows who is refused anyway (blind scoring, a frozen review): not a leak, listed. */
export function stricterThanPolicy(answer: Answer, expected: Expectation): boolean {
  return (
    expected === 'allow' && (answer.status === 403 || answer.status === 404 || answer.text.includes(STREAMED_NOT_FOUND))
  );
}

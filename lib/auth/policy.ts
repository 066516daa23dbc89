import type { Role } from '@/models/roles';

/**
 * Who may do what, in one place. Every route handler and server action asks `decide` through
 * the wrappers in ./handler.ts and ./action.ts; no page or handler decides permissions inline.
 */

export interface Actor {
  userId: number;
  /** teamId → role in that team. */
  roles: ReadonlyMap<number, Role>;
}

/** What the action is done to: the owning team and, where it matters, facts about the caller's relation to it. */
export interface Resource {
  teamId: number;
  authorId?: number;
  /** The caller is invited to this review round. */
  invited?: boolean;
  /** The caller has submitted their scorecard in this round. */
  submitted?: boolean;
  /** The team lets coaches publish. */
  coachesMayPublish?: boolean;
}

export type Decision = 'allow' | 'unauthorized' | 'not_found' | 'forbidden';

/** true allows, false forbids, 'hidden' answers as if the resource did not exist. */
type Rule = (role: Role, actor: Actor, resource: Resource) => boolean | 'hidden';

const STAFF: Role[] = ['owner', 'coach', 'reviewer'];
const ANY: Role[] = ['owner', 'coach', 'reviewer', 'athlete'];

const roles =
  (...allowed: Role[]): Rule =>
  (role) =>
    allowed.includes(role);
const authorOrOwner: Rule = (role, actor, resource) =>
  role === 'owner' || (role === 'coach' && resource.authorId === actor.userId);

const roundMember: Rule = (role, actor, resource) =>
  authorOrOwner(role, actor, resource) || resource.invited === true ? true : 'hidden';

export const POLICY = {
  'team.read': roles(...ANY),
  'team.members.list': roles('owner'),
  'team.members.invite': roles('owner'),
  'team.members.update': roles('owner'),
  'team.members.remove': roles('owner'),
  'team.audit.read': roles('owner'),
  'team.settings.update': roles('owner'),
  // Athletes read published verdicts, not work in progress (docs/architecture.md, "The roles").
  'review.list': roles(...STAFF),
  'review.read': roles(...STAFF),
  'review.create': roles('owner', 'coach'),
  'review.update': authorOrOwner,
  'review.delete': authorOrOwner,
  'review.round.open': authorOrOwner,
  // A round one was not invited to is not shown to exist.
  'review.round.scorecard': (_role, _actor, resource) => (resource.invited === true ? true : 'hidden'),
  'review.round.agreement': (role, actor, resource) =>
    authorOrOwner(role, actor, resource) || (resource.invited === true && resource.submitted === true),
  // Settling a round (resolutions, closing, "closed without", resolving comment threads): the
  // review's author or the owner.
  'review.round.settle': authorOrOwner,
  // A round and its threads: the review's author, the owner and the invited reviewers; to
  // anyone else (another coach, an uninvited reviewer, an athlete) the round does not exist.
  'review.round.read': roundMember,
  'review.round.comment': roundMember,
  'review.publish': (role, _actor, resource) =>
    role === 'owner' || (role === 'coach' && resource.coachesMayPublish === true),
  'study.read': roles(...STAFF),
  'study.write': roles('owner', 'coach'),
  'verdict.read': roles(...ANY),
  'search.read': roles(...STAFF),
  // The evidence watch (lib/watch): owners and coaches run it on demand; staff read its results
  // (athletes see its notice on the verdict page only); a verdict's author or the owner dismisses
  // a "new evidence to consider" offer.
  'evidence.watch.run': roles('owner', 'coach'),
  'evidence.watch.read': roles(...STAFF),
  // A flag's dry run is the engine's verdict of the review as it is now: not for reviewers, who
  // may be scoring a new round of it blind.
  'evidence.dryrun.read': roles('owner', 'coach'),
  'evidence.suggestion.dismiss': authorOrOwner,
} satisfies Record<string, Rule>;

export type Action = keyof typeof POLICY;
export const ACTIONS = Object.keys(POLICY) as Action[];

/**
 * May `actor` do `action` to `resource`? A signed-out caller is `unauthorized`; someone outside
 * the resource's team gets `not_found`, so another team's data is never confirmed to exist; a
 * member whose role does not allow it gets `forbidden`.
 */
export function decide(actor: Actor | null, action: Action, resource: Resource): Decision {
  if (!actor) return 'unauthorized';
  const role = actor.roles.get(resource.teamId);
  if (!role) return 'not_found';
  const verdict: boolean | 'hidden' = POLICY[action](role, actor, resource);
  if (verdict === 'hidden') return 'not_found';
  return verdict ? 'allow' : 'forbidden';
}

import { decide, type Action, type Actor } from '@/lib/auth/policy';
import type { NavItem } from './NavLinks';

/** The app's sections, each with the policy action its page needs in at least one team. */
const SECTIONS: readonly (NavItem & { needs?: Action })[] = [
  { href: '/dashboard', label: 'Dashboard' },
  { href: '/reviews', label: 'Reviews', needs: 'review.list' },
  { href: '/library', label: 'Library', needs: 'study.read' },
  { href: '/verdicts', label: 'Verdicts' },
  { href: '/search', label: 'Search', needs: 'search.read' },
  { href: '/team', label: 'Team' },
];

/**
 * The sections this person can open: a section whose page the policy refuses in every one of
 * their teams (an athlete's Reviews, Library and Search) is left out rather than shown as a
 * door that opens onto "you cannot see this".
 */
export function navFor(actor: Actor): NavItem[] {
  const teamIds = [...actor.roles.keys()];
  return SECTIONS.filter(
    ({ needs }) => !needs || teamIds.some((teamId) => decide(actor, needs, { teamId }) === 'allow'),
  ).map(({ href, label }) => ({ href, label }));
}

import { RoleBadge } from '@/components/team/RoleBadge';
import { ROLE_INFO } from '@/components/team/roles';
import { LinkButton } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import type { TeamSummary } from '@/lib/teams/teams';

/** The teams a person is in, each with their role and the next thing that role can do there. */
export function TeamList({ teams }: { teams: TeamSummary[] }) {
  if (teams.length === 0) {
    return (
      <EmptyState title="You are not in a team yet">
        <p>
          Everything in Loadbearing happens inside a team. Ask your lead coach or physiotherapist to invite you: their
          e-mail holds a link that adds you with the right role. If you left a team by mistake, its owner can invite you
          again.
        </p>
      </EmptyState>
    );
  }
  return (
    <ul className="grid gap-4 md:grid-cols-2" aria-label="Your teams">
      {teams.map((team) => (
        <li key={team.id}>
          <TeamCard team={team} />
        </li>
      ))}
    </ul>
  );
}

function TeamCard({ team }: { team: TeamSummary }) {
  const owner = team.role === 'owner';
  const alone = team.memberCount <= 1;
  return (
    <article className="border-line bg-paper-raised shadow-card flex h-full flex-col rounded-lg border p-5">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 className="min-w-0 text-xl font-semibold break-words">{team.name}</h3>
        <RoleBadge role={team.role} />
      </div>
      <p className="text-ink-muted mt-1 text-sm">
        {team.memberCount} {team.memberCount === 1 ? 'member' : 'members'} · as{' '}
        {ROLE_INFO[team.role].label.toLowerCase()} you {ROLE_INFO[team.role].youCan}.
      </p>
      {owner && alone && (
        <p className="border-rope-200 bg-accent-soft text-rope-800 mt-3 rounded-md border px-3 py-2 text-sm">
          It is just you so far. Invite the coaches who write reviews, a peer reviewer to score them, and the athletes
          who will read the verdicts.
        </p>
      )}
      <div className="mt-auto flex flex-wrap gap-2 pt-4">
        <LinkButton href={`/team?team=${team.id}`} variant={owner ? 'primary' : 'secondary'} size="sm">
          {owner ? (alone ? 'Invite your team' : 'Manage members') : 'View team'}
        </LinkButton>
      </div>
    </article>
  );
}

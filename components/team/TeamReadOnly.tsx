import { LinkButton } from '@/components/ui/Button';
import { Card, CardBody, CardHeader } from '@/components/ui/Card';
import type { TeamSummary } from '@/lib/teams/teams';
import { RoleBadge } from './RoleBadge';
import { ROLE_INFO } from './roles';

/** What a coach, reviewer or athlete sees on /team: their place in it and who to ask for changes. */
export function TeamReadOnly({ team }: { team: TeamSummary }) {
  return (
    <Card aria-labelledby="membership-heading" className="max-w-measure">
      <CardHeader id="membership-heading" title="Your membership" actions={<RoleBadge role={team.role} />} />
      <CardBody className="space-y-3">
        <p>
          You are {team.role === 'athlete' ? 'an' : 'a'} {ROLE_INFO[team.role].label.toLowerCase()} in {team.name}: you{' '}
          {ROLE_INFO[team.role].youCan}. The team has {team.memberCount} {team.memberCount === 1 ? 'member' : 'members'}
          .
        </p>
        <p
          className="border-line bg-paper-sunken text-ink-muted rounded-md border px-3 py-2 text-sm"
          data-testid="owner-only-notice"
        >
          Only the owner can manage members. To invite someone, change a role or leave the team, ask the team&apos;s
          owner.
        </p>
        <LinkButton href="/dashboard" size="sm">
          Back to dashboard
        </LinkButton>
      </CardBody>
    </Card>
  );
}

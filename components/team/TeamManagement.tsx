import { Card, CardBody, CardHeader } from '@/components/ui/Card';
import type { MemberRow, PendingInvitation } from '@/lib/teams/members';
import type { TeamSummary } from '@/lib/teams/teams';
import { InviteForm } from './InviteForm';
import { MembersTable } from './MembersTable';
import { PendingInvitations } from './PendingInvitations';
import { ROLE_INFO } from './roles';

// Dates are formatted here, on the server, so the client renders the same text (no hydration drift).
const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

/** Everything an owner does on /team: invite, see who is in, change roles, remove. */
export function TeamManagement({
  team,
  roster,
  userId,
}: {
  team: TeamSummary;
  roster: { members: MemberRow[]; invitations: PendingInvitation[] };
  userId: number;
}) {
  const members = roster.members.map((m) => ({
    membershipId: m.membershipId,
    name: m.name,
    email: m.email,
    role: m.role,
    joined: day.format(new Date(m.joinedAt)),
    isYou: m.userId === userId,
  }));
  const invitations = roster.invitations.map((i) => ({
    id: i.id,
    email: i.email,
    role: i.role,
    expires: day.format(new Date(i.expiresAt)),
  }));
  // Source order puts the invite form first: on a phone it is the first thing an owner reaches,
  // not the end of a long table. From lg up the table takes the left column again.
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem] lg:grid-rows-[auto_auto_1fr] lg:items-start">
      <Card aria-labelledby="invite-heading" className="lg:col-start-2">
        <CardHeader
          id="invite-heading"
          title="Invite someone"
          description="They get an e-mail with a link to join with this role."
        />
        <CardBody>
          <InviteForm teamId={team.id} />
        </CardBody>
      </Card>
      {invitations.length > 0 && (
        <Card aria-labelledby="pending-heading" className="lg:col-start-2">
          <CardHeader id="pending-heading" title="Waiting to join" description="Invitations not accepted yet." />
          <CardBody>
            <PendingInvitations teamId={team.id} invitations={invitations} />
          </CardBody>
        </Card>
      )}
      <Card aria-labelledby="members-heading" className="lg:col-start-1 lg:row-span-3 lg:row-start-1">
        <CardHeader
          id="members-heading"
          title="Members"
          description={`${members.length} ${members.length === 1 ? 'person' : 'people'} in ${team.name}.`}
        />
        <MembersTable teamId={team.id} teamName={team.name} members={members} />
      </Card>
      <Card aria-labelledby="roles-heading" className="lg:col-start-2">
        <CardHeader id="roles-heading" title="What each role can do" />
        <CardBody>
          <dl className="space-y-2 text-sm">
            {Object.values(ROLE_INFO).map((r) => (
              <div key={r.label}>
                <dt className="text-ink inline font-semibold">{r.label}: </dt>
                <dd className="text-ink-muted inline">{r.summary}.</dd>
              </div>
            ))}
          </dl>
        </CardBody>
      </Card>
    </div>
  );
}

import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/layout/PageHeader';
import { PublishingSettingsForm } from '@/components/team/PublishingSettingsForm';
import { TeamManagement } from '@/components/team/TeamManagement';
import { TeamReadOnly } from '@/components/team/TeamReadOnly';
import { TeamSwitcher } from '@/components/team/TeamSwitcher';
import { EmptyState } from '@/components/ui/EmptyState';
import { requirePageActor } from '@/lib/auth/current';
import { decide } from '@/lib/auth/policy';
import { teamSettings } from '@/lib/publishing/settings';
import { listMembers } from '@/lib/teams/members';
import { teamsOf } from '@/lib/teams/teams';
import { teamQuerySchema } from '@/lib/validation/team-forms';

export const metadata: Metadata = { title: 'Team' };

export default async function TeamPage({ searchParams }: { searchParams: Promise<Record<string, string | string[]>> }) {
  const actor = await requirePageActor('/team');
  const teams = await teamsOf(actor.userId);
  if (teams.length === 0) {
    return (
      <>
        <PageHeader title="Team" />
        <EmptyState title="You are not in a team yet">
          Ask a team owner to invite you; the link in their e-mail adds you.
        </EmptyState>
      </>
    );
  }
  const { team: requested } = teamQuerySchema.parse(await searchParams);
  const team = requested === undefined ? teams[0] : teams.find((t) => t.id === requested);
  // Another team's id is answered like a missing one, so it is never confirmed to exist.
  if (!team) notFound();
  const manages = decide(actor, 'team.members.list', { teamId: team.id }) === 'allow';
  const roster = manages ? await listMembers(team.id) : null;
  const settings =
    decide(actor, 'team.settings.update', { teamId: team.id }) === 'allow' ? await teamSettings(team.id) : null;
  return (
    <>
      <PageHeader
        eyebrow="Team"
        title={team.name}
        description={manages ? 'Invite people, set their roles and remove those who left.' : undefined}
      />
      {teams.length > 1 && <TeamSwitcher teams={teams} currentId={team.id} />}
      {roster ? <TeamManagement team={team} roster={roster} userId={actor.userId} /> : <TeamReadOnly team={team} />}
      {settings && <PublishingSettingsForm teamId={team.id} settings={settings} />}
    </>
  );
}

import type { Metadata } from 'next';
import { PageHeader } from '@/components/layout/PageHeader';
import { AddStudies } from '@/components/library/AddStudies';
import { StudyTable } from '@/components/library/StudyTable';
import { TeamTabs } from '@/components/review/TeamTabs';
import { pickTeam } from '@/components/review/viewer';
import { EmptyState } from '@/components/ui/EmptyState';
import { EvidenceWatchPanel } from '@/components/watch/EvidenceWatchPanel';
import { requirePageActor } from '@/lib/auth/current';
import { decide } from '@/lib/auth/policy';
import { teamsOf } from '@/lib/teams/teams';

export const metadata: Metadata = { title: 'Evidence library' };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

// GET /library?team&q&design&tag&sort&page&pageSize — the team's studies; the table pages on the server.
export default async function LibraryPage({ searchParams }: { searchParams: Promise<Search> }) {
  const actor = await requirePageActor('/library');
  const search = await searchParams;
  const teams = (await teamsOf(actor.userId)).filter((t) => decide(actor, 'study.read', { teamId: t.id }) === 'allow');
  const team = pickTeam(teams, search.team);
  if (!team) {
    return (
      <>
        <PageHeader title="Evidence library" />
        <EmptyState title="No library to show">The evidence library is for a team’s coaches and reviewers.</EmptyState>
      </>
    );
  }
  const canWrite = decide(actor, 'study.write', { teamId: team.id }) === 'allow';
  const initial = {
    q: one(search.q),
    design: one(search.design),
    tag: one(search.tag),
    sort: one(search.sort),
    page: Number(one(search.page)) || undefined,
    pageSize: Number(one(search.pageSize)) || undefined,
  };
  return (
    <>
      <PageHeader
        eyebrow={team.name}
        title="Evidence library"
        description="Studies the team links and appraises across all its reviews."
      />
      <TeamTabs teams={teams} currentId={team.id} basePath="/library" />
      <div className="space-y-8">
        {canWrite && <AddStudies teamId={team.id} />}
        <EvidenceWatchPanel
          teamId={team.id}
          canRun={decide(actor, 'evidence.watch.run', { teamId: team.id }) === 'allow'}
        />
        <StudyTable key={team.id} teamId={team.id} initial={initial} />
      </div>
    </>
  );
}

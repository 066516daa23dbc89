import type { Metadata } from 'next';
import { PageHeader } from '@/components/layout/PageHeader';
import { FollowButton } from '@/components/publishing/FollowButton';
import { VerdictSearch } from '@/components/search/VerdictSearch';
import { SafetyNotice } from '@/components/ui/SafetyNotice';
import { requirePageActor } from '@/lib/auth/current';
import { followedTeamIds } from '@/lib/follows/queries';
import { listVerdicts } from '@/lib/publishing/queries';
import { teamsOf } from '@/lib/teams/teams';

export const metadata: Metadata = { title: 'Verdicts' };

// /verdicts — the athlete's home: the teams' published verdicts, newest first, with search and following.
export default async function VerdictsPage() {
  const actor = await requirePageActor('/verdicts');
  const [teams, verdicts] = await Promise.all([teamsOf(actor.userId), listVerdicts(actor)]);
  const followed = await followedTeamIds(actor.userId);
  return (
    <>
      <PageHeader
        title="Verdicts"
        description="What your teams concluded about training claims, in plain words. Newest first."
      />
      <div className="grid gap-8 lg:grid-cols-[1fr_18rem]">
        <VerdictSearch initial={verdicts} />
        <aside aria-label="Following" className="space-y-4">
          {teams.map((t) => (
            <FollowButton key={t.id} teamId={t.id} teamName={t.name} following={followed.has(t.id)} />
          ))}
          <SafetyNotice />
        </aside>
      </div>
    </>
  );
}

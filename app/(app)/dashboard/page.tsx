import type { Metadata } from 'next';
import { LatestVerdicts } from '@/components/dashboard/LatestVerdicts';
import { NewEvidence } from '@/components/dashboard/NewEvidence';
import { PendingScorecards } from '@/components/dashboard/PendingScorecards';
import { listVerdicts } from '@/lib/publishing/queries';
import { TeamList } from '@/components/dashboard/TeamList';
import { PageHeader } from '@/components/layout/PageHeader';
import { findUser } from '@/lib/auth/accounts';
import { requirePageActor } from '@/lib/auth/current';
import { ReviewTable } from '@/components/review/ReviewTable';
import { decide } from '@/lib/auth/policy';
import { listReviews } from '@/lib/reviews/queries';
import { withBlindVerdictsHidden } from '@/lib/rounds/freeze';
import { pendingScorecards } from '@/lib/rounds/queries';
import { teamsOf } from '@/lib/teams/teams';
import { suggestionsFor } from '@/lib/watch/suggestions';

export const metadata: Metadata = { title: 'Dashboard' };

export default async function DashboardPage() {
  const actor = await requirePageActor('/dashboard');
  const [user, teams, scorecards, suggestions] = await Promise.all([
    findUser(actor.userId),
    teamsOf(actor.userId),
    pendingScorecards(actor.userId),
    suggestionsFor(actor),
  ]);
  const firstName = user?.name.split(/\s+/)[0];
  // The reviews of the first team where the person works on reviews (athletes read verdicts instead).
  const workTeam = teams.find((t) => decide(actor, 'review.list', { teamId: t.id }) === 'allow');
  const reviews = workTeam
    ? await withBlindVerdictsHidden(actor.userId, await listReviews(actor, { teamId: workTeam.id }))
    : null;
  return (
    <>
      <PageHeader
        eyebrow={firstName ? `Hello, ${firstName}` : undefined}
        title="Dashboard"
        description="Your teams and your role in each. Claims, reviews and verdicts live inside a team."
      />
      <PendingScorecards items={scorecards} />
      <NewEvidence items={suggestions} />
      <section aria-labelledby="teams-heading" className="space-y-4">
        <h2 id="teams-heading" className="text-xl font-semibold">
          Your teams
        </h2>
        <TeamList teams={teams} />
      </section>
      {!workTeam && <LatestVerdicts verdicts={await listVerdicts(actor, { limit: 5 })} />}
      {workTeam && reviews && (
        <section aria-labelledby="reviews-heading" className="mt-10 space-y-4">
          <h2 id="reviews-heading" className="text-xl font-semibold">
            Reviews in {workTeam.name}
          </h2>
          <ReviewTable
            teamId={workTeam.id}
            initial={reviews}
            canCreate={decide(actor, 'review.create', { teamId: workTeam.id }) === 'allow'}
          />
        </section>
      )}
    </>
  );
}

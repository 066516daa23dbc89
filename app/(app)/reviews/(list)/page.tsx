import type { Metadata } from 'next';
import { PageHeader } from '@/components/layout/PageHeader';
import { ReviewTable } from '@/components/review/ReviewTable';
import { TeamTabs } from '@/components/review/TeamTabs';
import { pickTeam } from '@/components/review/viewer';
import { LinkButton } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { requirePageActor } from '@/lib/auth/current';
import { decide } from '@/lib/auth/policy';
import { listReviews } from '@/lib/reviews/queries';
import { withBlindVerdictsHidden } from '@/lib/rounds/freeze';
import { teamsOf } from '@/lib/teams/teams';

export const metadata: Metadata = { title: 'Reviews' };

// GET /reviews?team=<id> — the team's reviews; the table sorts and filters in the browser.
export default async function ReviewsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const actor = await requirePageActor('/reviews');
  const teams = (await teamsOf(actor.userId)).filter((t) => decide(actor, 'review.list', { teamId: t.id }) === 'allow');
  const team = pickTeam(teams, (await searchParams).team);
  if (!team) {
    return (
      <>
        <PageHeader title="Reviews" />
        <EmptyState title="No reviews to show">
          Work-in-progress reviews are for the team’s coaches and reviewers. Athletes read the verdicts a team
          publishes.
        </EmptyState>
      </>
    );
  }
  const canCreate = decide(actor, 'review.create', { teamId: team.id }) === 'allow';
  // A reviewer still scoring a review blind does not see its verdict here either.
  const reviews = await withBlindVerdictsHidden(actor.userId, await listReviews(actor, { teamId: team.id }));
  return (
    <>
      <PageHeader
        eyebrow={team.name}
        title="Reviews"
        description="Claims the team is taking apart, with their status and current verdict."
        actions={
          canCreate ? (
            <LinkButton href="/reviews/new" variant="primary">
              New review
            </LinkButton>
          ) : undefined
        }
      />
      <TeamTabs teams={teams} currentId={team.id} basePath="/reviews" />
      <ReviewTable teamId={team.id} initial={reviews} canCreate={canCreate} />
    </>
  );
}

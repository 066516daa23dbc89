import type { Metadata } from 'next';
import { PageHeader } from '@/components/layout/PageHeader';
import { ClaimForm } from '@/components/review/ClaimForm';
import { LinkButton } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { requirePageActor } from '@/lib/auth/current';
import { decide } from '@/lib/auth/policy';
import { teamsOf } from '@/lib/teams/teams';

export const metadata: Metadata = { title: 'New review' };

// GET /reviews/new — capture a claim and its protocol; the form posts to /api/reviews.
export default async function NewReviewPage() {
  const actor = await requirePageActor('/reviews/new');
  const teams = (await teamsOf(actor.userId))
    .filter((t) => decide(actor, 'review.create', { teamId: t.id }) === 'allow')
    .map((t) => ({ id: t.id, name: t.name }));
  return (
    <>
      <PageHeader
        eyebrow="Step 1 of a review"
        title="Capture the claim"
        description="Write the claim down as it was made and the dose it prescribes. Mechanisms, evidence and the verdict come next, in the workbench."
      />
      {teams.length === 0 ? (
        <EmptyState
          title="You cannot start a review here"
          action={<LinkButton href="/reviews">Back to reviews</LinkButton>}
        >
          Reviews are started by a team’s owner or coaches. Ask your team owner if you should have that role.
        </EmptyState>
      ) : (
        <div className="max-w-3xl">
          <ClaimForm teams={teams} />
        </div>
      )}
    </>
  );
}

import type { Metadata } from 'next';
import { TeamList } from '@/components/dashboard/TeamList';
import { PageHeader } from '@/components/layout/PageHeader';
import { findUser } from '@/lib/auth/accounts';
import { requirePageActor } from '@/lib/auth/current';
import { teamsOf } from '@/lib/teams/teams';

export const metadata: Metadata = { title: 'Dashboard' };

export default async function DashboardPage() {
  const actor = await requirePageActor('/dashboard');
  const [user, teams] = await Promise.all([findUser(actor.userId), teamsOf(actor.userId)]);
  const firstName = user?.name.split(/\s+/)[0];
  return (
    <>
      <PageHeader
        eyebrow={firstName ? `Hello, ${firstName}` : undefined}
        title="Dashboard"
        description="Your teams and your role in each. Claims, reviews and verdicts live inside a team."
      />
      <section aria-labelledby="teams-heading" className="space-y-4">
        <h2 id="teams-heading" className="text-xl font-semibold">
          Your teams
        </h2>
        <TeamList teams={teams} />
      </section>
    </>
  );
}

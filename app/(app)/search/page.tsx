import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/layout/PageHeader';
import { SearchPanel } from '@/components/search/SearchPanel';
import { EmptyState } from '@/components/ui/EmptyState';
import { requirePageActor } from '@/lib/auth/current';
import { decide } from '@/lib/auth/policy';
import { listReviews } from '@/lib/reviews/queries';
import { teamsOf } from '@/lib/teams/teams';

export const metadata: Metadata = { title: 'Search' };

// /search — fuzzy search over the team's past reviews, mechanisms and studies (staff); athletes are sent to the verdicts.
export default async function SearchPage() {
  const actor = await requirePageActor('/search');
  const teams = (await teamsOf(actor.userId)).filter((t) => decide(actor, 'search.read', { teamId: t.id }) === 'allow');
  if (!teams.length) {
    return (
      <>
        <PageHeader title="Search" />
        <EmptyState
          title="Search is for the team’s coaches and reviewers"
          action={
            <Link className="prose-link" href="/verdicts">
              Search the published verdicts
            </Link>
          }
        >
          Athletes search the verdicts their teams published.
        </EmptyState>
      </>
    );
  }
  const tags = [...new Set((await listReviews(actor, {})).flatMap((r) => r.tags))].sort();
  return (
    <>
      <PageHeader
        title="Search"
        description="Past reviews, their mechanisms and the evidence library. A typo or a half-remembered word still finds them."
      />
      <SearchPanel teams={teams.map((t) => ({ id: t.id, name: t.name }))} tags={tags} />
    </>
  );
}

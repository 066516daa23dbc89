import type { Metadata } from 'next';
import { PageHeader } from '@/components/layout/PageHeader';
import { VerdictSearch } from '@/components/search/VerdictSearch';
import { SafetyNotice } from '@/components/ui/SafetyNotice';
import { listVerdicts } from '@/lib/publishing/queries';

export const metadata: Metadata = {
  title: 'Published verdicts',
  description: 'What coaching teams concluded about viral training claims, in plain words.',
};

// Rendered per request: a verdict published or withdrawn a moment ago shows here at once.
export const dynamic = 'force-dynamic';

/** /published — every team's public verdicts, newest first, searchable without an account. */
export default async function PublishedVerdictsPage() {
  const verdicts = await listVerdicts(null);
  return (
    <div className="max-w-shell px-gutter mx-auto w-full pt-8 pb-16">
      <PageHeader
        title="Published verdicts"
        description="What coaching teams concluded about training claims, in plain words. Newest first; no account needed."
      />
      <div className="grid gap-8 lg:grid-cols-[1fr_18rem]">
        <VerdictSearch initial={verdicts} emptyText="No team has published a verdict for everyone yet." />
        <aside aria-label="Before you try anything">
          <SafetyNotice />
        </aside>
      </div>
    </div>
  );
}

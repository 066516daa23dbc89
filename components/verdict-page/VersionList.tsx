import Link from 'next/link';
import type { VerdictPageDTO } from '@/lib/publishing/types';
import { longDate } from './labels';
import { VerdictPageLink } from '@/components/verdict-page/VerdictPageLink';

/** Every version of a verdict, newest first, with what changed and a link to read it as it was. */
export function VersionList({ page }: { page: VerdictPageDTO }) {
  return (
    <div className="max-w-measure mx-auto space-y-6">
      <header className="space-y-2">
        <p className="text-ink-muted text-sm font-semibold">Versions of a verdict by {page.snapshot.team.name}</p>
        <h1 className="text-3xl font-semibold">{page.snapshot.claim}</h1>
        <p>
          <VerdictPageLink slug={page.slug} className="prose-link">
            Back to the current verdict
          </VerdictPageLink>
        </p>
      </header>
      {page.withdrawn && (
        <p role="note" className="border-danger-100 bg-danger-50 text-danger-800 rounded-lg border px-4 py-3">
          Withdrawn on {longDate(page.withdrawn.at)}: {page.withdrawn.reason}
        </p>
      )}
      <ol className="space-y-3">
        {page.versions.map((v) => (
          <li key={v.number} className="border-line bg-paper-raised rounded-lg border p-4">
            <h2 className="text-lg font-semibold">
              <Link className="prose-link" href={`/v/${page.slug}/versions/${v.number}`}>
                Version {v.number}
              </Link>
              {v.number === page.latestNumber && <span className="text-ink-muted text-sm font-normal"> (current)</span>}
            </h2>
            <p className="text-ink-muted text-sm">
              Published {longDate(v.publishedAt)} by {v.publishedBy}
            </p>
            <p className="mt-2">{v.changeNote ? `What changed: ${v.changeNote}` : 'The first published version.'}</p>
          </li>
        ))}
      </ol>
    </div>
  );
}

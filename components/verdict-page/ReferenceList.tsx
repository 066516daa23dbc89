import type { SnapshotReference } from '@/lib/publishing/types';

/**
 * The references in APA form with DOI links, and downloads of the whole list in BibTeX and RIS.
 * `apaHtml` was sanitized when the version was published (lib/publishing/sanitize.ts).
 */
export function ReferenceList({ references, downloadBase }: { references: SnapshotReference[]; downloadBase: string }) {
  if (!references.length) return <p className="text-ink-muted">This verdict cites no studies.</p>;
  return (
    <div className="space-y-4">
      <ol className="space-y-3">
        {references.map((r) => (
          <li
            key={r.studyId}
            id={`ref-${r.studyId}`}
            // The reference a citation jumps to stands out (no script: the page has none).
            className="target:bg-rope-50 target:outline-rope-500 scroll-mt-6 break-inside-avoid rounded-sm pl-6 -indent-6 target:outline target:outline-2 target:outline-offset-2"
          >
            <div
              className="[&_a]:text-brand [&_a]:break-all [&_a]:underline [&_a]:decoration-2 [&_div]:inline"
              dangerouslySetInnerHTML={{ __html: r.apaHtml }}
            />
            {r.doi && !r.apa.includes('doi.org') && (
              <>
                {' '}
                <a className="prose-link break-all" href={`https://doi.org/${r.doi}`}>
                  https://doi.org/{r.doi}
                </a>
              </>
            )}
          </li>
        ))}
      </ol>
      <p className="flex flex-wrap gap-x-4 gap-y-2 text-sm print:hidden">
        <a className="prose-link" href={`${downloadBase}?format=bibtex`} download>
          Download the references (BibTeX)
        </a>
        <a className="prose-link" href={`${downloadBase}?format=ris`} download>
          Download the references (RIS)
        </a>
      </p>
    </div>
  );
}

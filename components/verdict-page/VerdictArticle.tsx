import Link from 'next/link';
import { SafetyNotice } from '@/components/ui/SafetyNotice';
import type { VerdictPageDTO } from '@/lib/publishing/types';
import { AudienceAdvice } from './AudienceAdvice';
import { VerdictChip } from '@/components/verdict/VerdictChip';
import { EvidenceChangedNotice } from './EvidenceChangedNotice';
import { longDate } from './labels';
import { MechanismRanking } from './MechanismRanking';
import { ProtocolPlain } from './ProtocolPlain';
import { ReferenceList } from './ReferenceList';
import { VerdictFirmness } from './VerdictFirmness';
import { VerdictPageLink } from '@/components/verdict-page/VerdictPageLink';

/** Section headings share one look; each section is labelled by its heading for landmark navigation. */
function Section({ id, title, children }: { id: string; title: string; children: React.ReactNode }) {
  return (
    <section aria-labelledby={id} className="space-y-3">
      <h2 id={id} className="text-2xl font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/**
 * The athlete's verdict page, all server-rendered from one immutable snapshot (no client
 * script): claim, verdict, summary, cautions, protocol, mechanisms, advice, the team's analysis,
 * references, and who published which version when.
 */
export function VerdictArticle({ page, latest }: { page: VerdictPageDTO; latest: boolean }) {
  const s = page.snapshot;
  return (
    <article className="max-w-measure mx-auto w-full space-y-10 print:max-w-none">
      {page.withdrawn && (
        <div role="note" className="border-danger-100 bg-danger-50 text-danger-800 rounded-lg border px-4 py-3">
          <p className="font-semibold">This verdict was withdrawn on {longDate(page.withdrawn.at)}.</p>
          <p className="mt-1">Why: {page.withdrawn.reason}</p>
          <p className="mt-1 text-sm">It stays readable so you can see what was said; do not act on it.</p>
        </div>
      )}
      {latest && <EvidenceChangedNotice notices={page.evidenceChanged ?? []} />}
      {!latest && (
        <div role="note" className="border-warning-100 bg-warning-50 text-warning-800 rounded-lg border px-4 py-3">
          You are reading version {page.version.number}, an earlier version.{' '}
          <VerdictPageLink slug={page.slug} className="font-semibold underline">
            Read the current version ({page.latestNumber})
          </VerdictPageLink>
          .
        </div>
      )}

      <header className="space-y-4">
        <p className="text-ink-muted text-sm font-semibold">
          A verdict by {s.team.name}
          {page.visibility === 'team' ? ' · for team members' : ''}
        </p>
        <h1 className="text-3xl leading-tight font-semibold sm:text-4xl">{s.claim}</h1>
        <div className="flex flex-wrap items-center gap-3">
          <span className="text-sm font-semibold">Verdict:</span>
          <VerdictChip verdict={s.verdict.key} label={s.verdict.label} className="px-3 py-1 text-sm" />
        </div>
        <p className="text-lg">{s.verdict.summary}</p>
        <p className="text-ink-muted text-sm">
          Claim made by {s.claimSource || 'an unnamed source'}
          {s.claimUrl && (
            <>
              {' '}
              (
              <a className="prose-link break-all" href={s.claimUrl} rel="nofollow noopener">
                where it was made
              </a>
              )
            </>
          )}
          .
        </p>
      </header>

      <SafetyNotice />

      {s.robustness && (
        <Section id="firmness" title="How firm is this verdict?">
          <VerdictFirmness robustness={s.robustness} />
        </Section>
      )}

      <Section id="protocol" title="The protocol, in everyday words">
        <ProtocolPlain everyday={s.everyday} />
      </Section>

      <Section id="mechanisms" title="Why it might work: the mechanisms, most likely first">
        <p className="text-ink-muted text-sm">
          Each mechanism is a way the protocol could cause the promised result. The words come from a fixed scale of
          likelihood; the share says how much of the expected effect that mechanism would explain.
        </p>
        <MechanismRanking mechanisms={s.mechanisms} />
      </Section>

      <Section id="advice" title="Should you try it?">
        <AudienceAdvice recommendations={s.recommendations} />
        <SafetyNotice compact className="border-line rounded-lg border px-4 py-3" />
      </Section>

      {s.bodyHtml && (
        <Section id="analysis" title="The team’s analysis">
          <div
            className="[&_a]:text-brand [&_aside]:border-granite-300 [&_aside]:bg-granite-50 space-y-3 [&_a]:underline [&_a]:decoration-2 [&_aside]:rounded-md [&_aside]:border-l-4 [&_aside]:px-3 [&_aside]:py-2 [&_blockquote]:border-l-4 [&_blockquote]:pl-3 [&_h3]:mt-6 [&_h3]:text-xl [&_h3]:font-semibold [&_h4]:mt-4 [&_h4]:font-semibold [&_ol]:list-decimal [&_ol]:pl-5 [&_ul]:list-disc [&_ul]:pl-5"
            dangerouslySetInnerHTML={{ __html: s.bodyHtml }}
          />
        </Section>
      )}

      <Section id="references" title="References">
        <ReferenceList references={s.references} downloadBase={`/v/${page.slug}/references`} />
      </Section>

      <footer className="border-line text-ink-muted space-y-1 border-t pt-4 text-sm">
        <p>
          Written by {s.authors.join(', ')} for {s.team.name}. Version {page.version.number}, published{' '}
          {longDate(page.version.publishedAt)} by {page.version.publishedBy}.
        </p>
        {page.version.changeNote && <p>What changed in this version: {page.version.changeNote}</p>}
        <p className="print:hidden">
          <Link className="prose-link" href={`/v/${page.slug}/versions`}>
            All versions and what changed ({page.versions.length})
          </Link>
        </p>
      </footer>
    </article>
  );
}

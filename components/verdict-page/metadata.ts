import type { Metadata } from 'next';
import { env } from '@/lib/env';
import type { VerdictPageDTO } from '@/lib/publishing/types';

/** Title, description and Open Graph for sharing; team-only verdicts are kept out of search engines. */
export function verdictMetadata(page: VerdictPageDTO, version?: number): Metadata {
  const s = page.snapshot;
  const title = `${s.verdict.label}: ${s.claim}`;
  const description = s.verdict.summary.slice(0, 300);
  const path = version ? `/v/${page.slug}/versions/${version}` : `/v/${page.slug}`;
  return {
    title,
    description,
    alternates: { canonical: `/v/${page.slug}` },
    metadataBase: new URL(env().APP_URL),
    robots: page.visibility === 'public' && !page.withdrawn ? undefined : { index: false, follow: false },
    openGraph: {
      type: 'article',
      title,
      description,
      url: path,
      siteName: 'Loadbearing',
      publishedTime: page.version.publishedAt,
      authors: s.authors,
    },
    twitter: { card: 'summary', title, description },
  };
}

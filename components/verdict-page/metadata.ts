import type { Metadata } from 'next';
import { env } from '@/lib/env';
import type { VerdictPageDTO } from '@/lib/publishing/types';

/** What a shared link shows, worked out once for both routers' ways of writing it into <head>. */
export function verdictShareFields(page: VerdictPageDTO, version?: number) {
  const s = page.snapshot;
  return {
    title: `${s.verdict.label}: ${s.claim}`,
    description: s.verdict.summary.slice(0, 300),
    url: new URL(version ? `/v/${page.slug}/versions/${version}` : `/v/${page.slug}`, env().APP_URL).toString(),
    canonical: new URL(`/v/${page.slug}`, env().APP_URL).toString(),
    // Team-only and withdrawn verdicts are kept out of search engines.
    indexable: page.visibility === 'public' && !page.withdrawn,
    publishedTime: page.version.publishedAt,
    authors: s.authors,
  };
}

/** Title, description and Open Graph for sharing (App Router pages). */
export function verdictMetadata(page: VerdictPageDTO, version?: number): Metadata {
  const f = verdictShareFields(page, version);
  return {
    title: f.title,
    description: f.description,
    alternates: { canonical: f.canonical },
    robots: f.indexable ? undefined : { index: false, follow: false },
    openGraph: {
      type: 'article',
      title: f.title,
      description: f.description,
      url: f.url,
      siteName: 'Loadbearing',
      publishedTime: f.publishedTime,
      authors: f.authors,
    },
    twitter: { card: 'summary', title: f.title, description: f.description },
  };
}

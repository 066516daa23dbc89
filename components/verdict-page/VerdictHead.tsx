import Head from 'next/head';
import type { VerdictPageDTO } from '@/lib/publishing/types';
import { verdictShareFields } from './metadata';

/** The same title, description and Open Graph as verdictMetadata, for the Pages Router's <Head>. */
export function VerdictHead({ page }: { page: VerdictPageDTO }) {
  const f = verdictShareFields(page);
  return (
    <Head>
      <title>{`${f.title} · Loadbearing`}</title>
      <meta name="description" content={f.description} />
      <link rel="canonical" href={f.canonical} />
      {!f.indexable && <meta name="robots" content="noindex, nofollow" />}
      <meta property="og:type" content="article" />
      <meta property="og:title" content={f.title} />
      <meta property="og:description" content={f.description} />
      <meta property="og:url" content={f.url} />
      <meta property="og:site_name" content="Loadbearing" />
      <meta property="article:published_time" content={f.publishedTime} />
      {f.authors.map((name) => (
        <meta key={name} property="article:author" content={name} />
      ))}
      <meta name="twitter:card" content="summary" />
      <meta name="twitter:title" content={f.title} />
      <meta name="twitter:description" content={f.description} />
    </Head>
  );
}

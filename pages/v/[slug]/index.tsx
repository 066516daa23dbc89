import type { GetStaticPaths, GetStaticProps, PageConfig } from 'next';
import { LatestVerdictPage } from '@/components/verdict-page/LatestVerdictPage';
import { findVerdictPage } from '@/lib/publishing/queries';
import type { VerdictPageDTO } from '@/lib/publishing/types';

/**
 * /v/[slug] for everyone who is not signed in: the latest version of a public verdict, rendered
 * once and then served from the page cache until the next publish, unpublish or delete drops it
 * (lib/publishing/page-cache.ts); under `npm start` the front cache (lib/cache/front-cache.ts)
 * answers before Next is asked at all. Team-only and unknown slugs are 404 here. Signed-in readers
 * never reach this page: proxy.ts sends them to ./signed-in, which checks membership.
 *
 * Why the Pages Router: athletes read this on phones, and the page is plain reading. Here Next
 * can send it with no JavaScript at all (`unstable_runtimeJS: false`); an App Router page always
 * loads the client router and React (about 130 KB gzipped in Next 16), which the page never uses.
 */
export const config: PageConfig = { unstable_runtimeJS: false };

// Every slug is rendered on its first visit (publishing happens after the build).
export const getStaticPaths: GetStaticPaths = async () => ({ paths: [], fallback: 'blocking' });

// A safety net only: publishing drops the cached page at once; an edit nobody announced (a
// publisher's new name) shows within five minutes.
const REFRESH_SECONDS = 300;

export const getStaticProps: GetStaticProps<{ page: VerdictPageDTO }, { slug: string }> = async ({ params }) => {
  const page = await findVerdictPage(params?.slug ?? '', null);
  if (!page) return { notFound: true, revalidate: REFRESH_SECONDS };
  return { props: { page }, revalidate: REFRESH_SECONDS };
};

export default function PublicVerdictPage({ page }: { page: VerdictPageDTO }) {
  return <LatestVerdictPage page={page} signedIn={false} />;
}

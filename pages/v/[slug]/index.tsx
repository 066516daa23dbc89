import type { GetServerSideProps, PageConfig } from 'next';
import { LatestVerdictPage } from '@/components/verdict-page/LatestVerdictPage';
import { MissingVerdictPage } from '@/components/verdict-page/MissingVerdictPage';
import { publicVerdictCacheHeaders } from '@/lib/publishing/page-cache-control';
import { findVerdictPage } from '@/lib/publishing/queries';
import type { VerdictPageDTO } from '@/lib/publishing/types';

/**
 * /v/[slug] for everyone who is not signed in: the latest version of a public verdict. Rendered
 * from the database on each request that reaches the app, and marked for shared caches to keep
 * for at most one second (lib/publishing/page-cache-control.ts): the nginx in front
 * (deploy/nginx/loadbearing.conf) answers nearly every reader from that copy, and a publish,
 * withdrawal or deletion on any app process shows to every reader within the stated bound
 * (docs/deployment.md). Team-only and unknown slugs are 404 here, answered by this page itself
 * (no JavaScript, like the verdict) rather than the app's not-found page, whose scripts the
 * verdict page's `script-src 'none'` policy would block. Signed-in readers never reach
 * this page: proxy.ts sends them to ./signed-in, which checks membership.
 *
 * Why the Pages Router: athletes read this on phones, and the page is plain reading. Here Next
 * can send it with no JavaScript at all (`unstable_runtimeJS: false`); an App Router page always
 * loads the client router and React (about 130 KB gzipped in Next 16), which the page never uses.
 */
export const config: PageConfig = { unstable_runtimeJS: false };

export const getServerSideProps: GetServerSideProps<{ page: VerdictPageDTO | null }, { slug: string }> = async ({
  params,
  res,
}) => {
  for (const [name, value] of Object.entries(publicVerdictCacheHeaders())) res.setHeader(name, value);
  const page = await findVerdictPage(params?.slug ?? '', null);
  if (!page) res.statusCode = 404;
  return { props: { page } };
};

export default function PublicVerdictPage({ page }: { page: VerdictPageDTO | null }) {
  if (!page) return <MissingVerdictPage signedIn={false} />;
  return <LatestVerdictPage page={page} signedIn={false} />;
}

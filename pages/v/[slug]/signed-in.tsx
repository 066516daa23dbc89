import type { GetServerSideProps, PageConfig } from 'next';
import { LatestVerdictPage } from '@/components/verdict-page/LatestVerdictPage';
import { MissingVerdictPage } from '@/components/verdict-page/MissingVerdictPage';
import { actorFromRequest } from '@/lib/auth/request-actor';
import { findVerdictPage } from '@/lib/publishing/queries';
import type { VerdictPageDTO } from '@/lib/publishing/types';

/**
 * /v/[slug] for a request that carries a session cookie (proxy.ts rewrites it here): rendered
 * per request because what it shows depends on the reader — team-only verdicts for their team's
 * members, 404 for anyone else — and the header knows they are signed in. No JavaScript either.
 */
export const config: PageConfig = { unstable_runtimeJS: false };

export const getServerSideProps: GetServerSideProps<
  { page: VerdictPageDTO | null; signedIn: boolean },
  { slug: string }
> = async ({ params, req, res }) => {
  const actor = await actorFromRequest(req, res);
  const page = await findVerdictPage(params?.slug ?? '', actor);
  // 404 on this page itself, without JavaScript, like the verdict (./index.tsx).
  if (!page) res.statusCode = 404;
  return { props: { page, signedIn: actor !== null } };
};

export default function ReaderVerdictPage({ page, signedIn }: { page: VerdictPageDTO | null; signedIn: boolean }) {
  if (!page) return <MissingVerdictPage signedIn={signedIn} />;
  return <LatestVerdictPage page={page} signedIn={signedIn} />;
}

import type { Metadata } from 'next';
import Link from 'next/link';
import { connection } from 'next/server';
import { LogoMark } from '@/components/layout/Logo';
import { NotFoundPanel } from '@/components/layout/NotFoundPanel';

export const metadata: Metadata = { title: 'Not found' };

export default async function NotFound() {
  // Rendered per request, never prerendered: every page carries the request's CSP nonce on its
  // scripts (proxy.ts), and a page built ahead of time has none, so the browser would block them
  // (https://nextjs.org/docs/app/guides/content-security-policy, "Nonces").
  await connection();
  return (
    <div className="flex flex-1 flex-col justify-center">
      {/* An unknown address shows in the root layout only, which has no header to say where you are
          (a missing verdict has its own page without scripts: components/verdict-page/MissingVerdictPage.tsx). */}
      <p className="max-w-measure px-gutter mx-auto w-full pt-10" aria-hidden="true">
        <LogoMark className="size-10" />
      </p>
      <NotFoundPanel title="Nothing is hanging on this hold">
        <p>
          The page you asked for does not exist, or it belongs to a team you are not in — a verdict shared only with its
          team’s members, for instance. Check the address; if you are a member,{' '}
          <Link className="prose-link" href="/sign-in">
            sign in
          </Link>{' '}
          and open the link again.
        </p>
      </NotFoundPanel>
    </div>
  );
}

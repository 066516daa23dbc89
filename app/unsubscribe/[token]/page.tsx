import type { Metadata } from 'next';
import { PublicHeader } from '@/components/layout/PublicHeader';
import { UnsubscribeForm } from '@/components/publishing/UnsubscribeForm';
import { currentActor } from '@/lib/auth/current';
import { followForToken } from '@/lib/follows/follows';

export const metadata: Metadata = { title: 'Stop verdict e-mails', robots: { index: false } };

// /unsubscribe/[token] — the link in every verdict mail; works without signing in.
export default async function UnsubscribePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const follow = await followForToken(token);
  return (
    <>
      <PublicHeader signedIn={(await currentActor()) !== null} />
      <main id="main" className="px-gutter max-w-measure mx-auto w-full flex-1 py-12">
        <h1 className="text-3xl font-semibold">Stop verdict e-mails</h1>
        {follow ? (
          <UnsubscribeForm token={token} teamName={follow.teamName} />
        ) : (
          <p className="mt-4">This link is no longer valid: you may already have stopped these mails.</p>
        )}
      </main>
    </>
  );
}

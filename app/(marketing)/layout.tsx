import { PublicHeader } from '@/components/layout/PublicHeader';
import { currentActor } from '@/lib/auth/current';

export default async function MarketingLayout({ children }: { children: React.ReactNode }) {
  const actor = await currentActor();
  return (
    <>
      <PublicHeader signedIn={Boolean(actor)} />
      <main id="main" className="flex-1">
        {children}
      </main>
    </>
  );
}

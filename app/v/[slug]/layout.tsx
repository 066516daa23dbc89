import { PublicHeader } from '@/components/layout/PublicHeader';
import { currentActor } from '@/lib/auth/current';

// Verdict pages are for athletes and the public: the public header, not the workbench shell.
export default async function VerdictLayout({ children }: { children: React.ReactNode }) {
  const signedIn = (await currentActor()) !== null;
  return (
    <>
      <div className="print:hidden">
        <PublicHeader signedIn={signedIn} />
      </div>
      <main id="main" className="px-gutter w-full flex-1 pt-8 pb-16">
        {children}
      </main>
    </>
  );
}

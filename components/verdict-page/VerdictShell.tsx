import { PublicHeader } from '@/components/layout/PublicHeader';
import { SiteFooter } from '@/components/layout/SiteFooter';
import { SkipLink } from '@/components/layout/SkipLink';

/**
 * The frame of the Pages Router's verdict pages, the same as the App Router's root layout plus
 * app/v/[slug]/layout.tsx give the version pages: skip link, public header, main, safety footer.
 */
export function VerdictShell({ signedIn, children }: { signedIn: boolean; children: React.ReactNode }) {
  return (
    <>
      <SkipLink />
      <div className="print:hidden">
        <PublicHeader signedIn={signedIn} />
      </div>
      <main id="main" className="px-gutter w-full flex-1 pt-8 pb-16">
        {children}
      </main>
      <SiteFooter />
    </>
  );
}

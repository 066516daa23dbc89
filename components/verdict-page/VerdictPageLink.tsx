import Link from 'next/link';
import type { ReactNode } from 'react';

/**
 * A link to a published verdict page. That page is the Pages Router page without JavaScript
 * (docs/architecture.md, "The verdict page"): the App Router cannot prefetch it — its RSC prefetch
 * is redirected and then left hanging in the browser — and a click loads it as a whole page anyway.
 */
export function VerdictPageLink({
  slug,
  className,
  children,
}: {
  slug: string;
  className?: string;
  children: ReactNode;
}) {
  return (
    <Link prefetch={false} href={`/v/${slug}`} className={className}>
      {children}
    </Link>
  );
}

'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { cn } from '@/components/ui/cn';

export interface NavItem {
  href: string;
  label: string;
  /** A section whose pages are not built yet: shown, so the shape of the product is visible, but not a dead link. */
  soon?: boolean;
}

/** The app's sections; the current one is marked for screen readers as well as by colour. */
export function NavLinks({ items, compact = false }: { items: readonly NavItem[]; compact?: boolean }) {
  // Null only under the Pages Router, which never renders the workbench's navigation.
  const pathname = usePathname() ?? '';
  return (
    <ul
      className={cn(
        'flex [scrollbar-width:none] overflow-x-auto pb-px',
        compact ? '-mx-2 justify-between' : '-mx-1 gap-1 px-1',
      )}
    >
      {items.map((item) => {
        const current = pathname === item.href || pathname.startsWith(`${item.href}/`);
        const box = cn(
          'relative inline-flex min-h-11 items-center rounded-md font-semibold transition-colors',
          // Phones: all six sections fit a 375px row without scrolling (labels 296px of 351px).
          compact ? 'px-1 text-[0.8125rem] after:inset-x-1' : 'px-3 text-sm after:inset-x-2',
        );
        return (
          <li key={item.href} className="shrink-0">
            {item.soon ? (
              <span aria-disabled="true" title="Coming soon" className={cn(box, 'text-chalk-400 cursor-default')}>
                {item.label}
                <span className="sr-only"> (coming soon)</span>
              </span>
            ) : (
              <Link
                href={item.href}
                aria-current={current ? 'page' : undefined}
                className={cn(
                  box,
                  current ? 'text-brand' : 'text-ink-muted hover:bg-paper-sunken hover:text-ink',
                  current && 'after:bg-rope-500 after:absolute after:-bottom-px after:h-0.5 after:rounded-full',
                )}
              >
                {item.label}
              </Link>
            )}
          </li>
        );
      })}
    </ul>
  );
}

import Link from 'next/link';
import { Logo } from './Logo';
import { NavLinks, type NavItem } from './NavLinks';
import { SignOutButton } from './SignOutButton';

/** The signed-in header: sections on the left, who is signed in and the way out on the right. */
export function AppHeader({ user, nav }: { user: { name: string; email: string }; nav: readonly NavItem[] }) {
  return (
    <header className="border-line bg-paper/95 supports-[backdrop-filter]:bg-paper/85 sticky top-0 z-30 border-b backdrop-blur">
      <div className="max-w-shell px-gutter mx-auto">
        <div className="flex items-center justify-between gap-3 pt-3 md:pt-0">
          <div className="flex min-w-0 items-center gap-6">
            <Logo href="/dashboard" />
            <nav aria-label="Main" className="hidden md:block md:py-2">
              <NavLinks items={nav} />
            </nav>
          </div>
          <div className="flex min-w-0 items-center gap-3">
            {/* Who is signed in, and the way to their account page (password). */}
            <Link
              href="/account"
              className="hover:bg-granite-100 flex min-w-0 items-center gap-2.5 rounded-md px-1.5 py-1 leading-tight"
              data-testid="signed-in-user"
            >
              <span className="sr-only">Your account: signed in as </span>
              {/* Phones have room for initials only; the full name is still read out. */}
              <span
                aria-hidden="true"
                title={`${user.name} (${user.email}): your account`}
                className="bg-granite-100 font-display text-granite-800 grid size-9 shrink-0 place-items-center rounded-full text-sm font-semibold sm:hidden"
              >
                {initials(user.name)}
              </span>
              <span className="sr-only sm:not-sr-only sm:block sm:min-w-0 sm:text-right">
                <span className="text-ink block truncate text-sm font-semibold underline-offset-2 hover:underline">
                  {user.name}
                </span>
                <span className="text-ink-muted block truncate text-xs">{user.email}</span>
              </span>
            </Link>
            <SignOutButton />
          </div>
        </div>
        {/* Phones: the sections get their own scrollable row instead of a hidden menu. */}
        <nav aria-label="Main" className="pt-1 md:hidden">
          <NavLinks items={nav} compact />
        </nav>
      </div>
    </header>
  );
}

function initials(name: string): string {
  const parts = name.trim().split(/\s+/);
  return ((parts[0]?.[0] ?? '') + (parts.length > 1 ? parts[parts.length - 1][0] : '')).toUpperCase() || '?';
}

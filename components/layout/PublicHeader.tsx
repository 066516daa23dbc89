import { LinkButton } from '@/components/ui/Button';
import { Logo } from './Logo';

/** The header of public pages: the way in, or back to work for someone already signed in. */
export function PublicHeader({ signedIn }: { signedIn: boolean }) {
  return (
    <header className="border-line bg-paper border-b">
      <div className="max-w-shell px-gutter mx-auto flex items-center justify-between gap-3 py-3">
        <Logo />
        <nav aria-label="Account" className="flex items-center gap-1 sm:gap-2">
          <LinkButton href="/published" variant="ghost" size="sm">
            Verdicts
          </LinkButton>
          {signedIn ? (
            <LinkButton href="/dashboard" variant="primary" size="sm">
              {/* A phone's header row has room for the short form only. */}
              <span className="sm:hidden">Dashboard</span>
              <span className="hidden sm:inline">Go to dashboard</span>
            </LinkButton>
          ) : (
            <>
              <LinkButton href="/sign-in" variant="ghost" size="sm">
                Sign in
              </LinkButton>
              {/* Phones get this from the page itself; the header row has room for one button. The
                  wrapper hides it: on the button itself, its own inline-flex wins over `hidden`. */}
              <span className="hidden sm:inline-flex">
                <LinkButton href="/sign-up" variant="primary" size="sm">
                  Create account
                </LinkButton>
              </span>
            </>
          )}
        </nav>
      </div>
    </header>
  );
}

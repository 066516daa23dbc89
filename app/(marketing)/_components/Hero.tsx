import { LinkButton } from '@/components/ui/Button';
import { VerdictPreview } from './VerdictPreview';

export function Hero({ signedIn }: { signedIn: boolean }) {
  return (
    <section className="border-line from-granite-50 to-paper relative overflow-hidden border-b bg-linear-to-b">
      <div className="max-w-shell px-gutter lg:py-section mx-auto grid items-center gap-10 py-12 sm:py-16 lg:grid-cols-[minmax(0,1.1fr)_minmax(0,1fr)]">
        <div>
          <p className="text-accent-text text-sm font-semibold tracking-wide uppercase">
            For strength coaches, climbing coaches and sports physios
          </p>
          <h1 className="mt-3 text-4xl font-semibold sm:text-5xl">
            Someone promised a shortcut. Find out what actually carries the load.
          </h1>
          <p className="max-w-measure text-ink-muted mt-5 text-lg">
            Loadbearing is where your team takes a viral training claim apart: the protocol as a real dose, every
            mechanism that could explain the result, the studies for and against each one. Colleagues score it blind,
            and you publish a verdict in plain words that your athletes can read before they try it.
          </p>
          <div className="mt-8 flex flex-wrap gap-3">
            {signedIn ? (
              <LinkButton href="/dashboard" variant="primary" size="lg">
                Go to dashboard
              </LinkButton>
            ) : (
              <>
                <LinkButton href="/sign-up" variant="primary" size="lg">
                  Start a team
                </LinkButton>
                <LinkButton href="/sign-in" size="lg">
                  Sign in
                </LinkButton>
              </>
            )}
          </div>
        </div>
        <VerdictPreview />
      </div>
    </section>
  );
}

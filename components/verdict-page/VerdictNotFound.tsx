import Link from 'next/link';

/** Also the answer for a team-only verdict read by someone outside the team: its existence is not confirmed. */
export function VerdictNotFound() {
  return (
    <section aria-labelledby="nf" className="max-w-measure mx-auto py-10">
      <p className="font-display text-rope-500 text-5xl font-semibold" aria-hidden="true">
        404
      </p>
      <h1 id="nf" className="mt-2 text-3xl font-semibold">
        This verdict was not found
      </h1>
      <p className="text-ink-muted mt-3">
        The link may be mistyped, or the verdict is shared only with its team’s members. If you are one, sign in and
        open the link again.
      </p>
      <p className="mt-6 flex flex-wrap gap-4">
        <Link className="prose-link" href="/sign-in">
          Sign in
        </Link>
        <Link className="prose-link" href="/">
          Start page
        </Link>
      </p>
    </section>
  );
}

import type { PageConfig } from 'next';
import Head from 'next/head';
import Link from 'next/link';
import { VerdictShell } from '@/components/verdict-page/VerdictShell';

// When a verdict page fails to render. Nothing is lost: reading changes nothing.
export const config: PageConfig = { unstable_runtimeJS: false };

export default function VerdictPageError() {
  return (
    <VerdictShell signedIn={false}>
      <Head>
        <title>Something went wrong · Loadbearing</title>
        <meta name="robots" content="noindex" />
      </Head>
      <section aria-labelledby="err" className="max-w-measure mx-auto py-10">
        <h1 id="err" className="text-3xl font-semibold">
          This verdict could not be shown just now
        </h1>
        <p className="text-ink-muted mt-3">Please reload the page in a moment. If it keeps happening, tell the team.</p>
        <p className="mt-6">
          <Link className="prose-link" href="/">
            Start page
          </Link>
        </p>
      </section>
    </VerdictShell>
  );
}

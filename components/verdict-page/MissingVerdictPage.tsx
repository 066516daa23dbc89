import Head from 'next/head';
import { VerdictNotFound } from './VerdictNotFound';
import { VerdictShell } from './VerdictShell';

/** The Pages Router's verdict pages when the slug is unknown or not this reader's: a 404 with no script. */
export function MissingVerdictPage({ signedIn }: { signedIn: boolean }) {
  return (
    <VerdictShell signedIn={signedIn}>
      <Head>
        <title>Verdict not found · Loadbearing</title>
        <meta name="robots" content="noindex" />
      </Head>
      <VerdictNotFound />
    </VerdictShell>
  );
}

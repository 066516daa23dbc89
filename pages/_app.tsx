import type { AppProps } from 'next/app';
import Head from 'next/head';
import { fontVariables } from '@/components/layout/fonts';
import '../app/globals.css';

/**
 * The verdict pages' frame: the same stylesheet and fonts as the App Router's root layout. The
 * font variables sit on this wrapper (next/font is not allowed in _document), so it also sets the
 * sans face that `html` would otherwise resolve without them.
 */
export default function VerdictPagesApp({ Component, pageProps }: AppProps) {
  return (
    <>
      <Head>
        <meta name="viewport" content="width=device-width, initial-scale=1" />
      </Head>
      <div className={`${fontVariables} flex min-h-dvh flex-1 flex-col font-sans`}>
        <Component {...pageProps} />
      </div>
    </>
  );
}

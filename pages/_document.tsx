import { Head, Html, Main, NextScript } from 'next/document';

// The document of the verdict pages (the only Pages Router routes; see pages/v/[slug]/index.tsx for why).
export default function Document() {
  return (
    <Html lang="en">
      <Head>
        <meta name="theme-color" content="#274a41" />
      </Head>
      <body className="flex min-h-dvh flex-col">
        <Main />
        <NextScript />
      </body>
    </Html>
  );
}

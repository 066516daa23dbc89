import type { Metadata, Viewport } from 'next';
import localFont from 'next/font/local';
import { SiteFooter } from '@/components/layout/SiteFooter';
import './globals.css';

// Shipped with the app (app/fonts, SIL Open Font License) so a machine without network renders the same.
const inter = localFont({
  src: [
    { path: './fonts/inter-latin-wght-normal.woff2', weight: '100 900', style: 'normal' },
    { path: './fonts/inter-latin-wght-italic.woff2', weight: '100 900', style: 'italic' },
  ],
  variable: '--font-inter',
  display: 'swap',
});

const spaceGrotesk = localFont({
  src: [{ path: './fonts/space-grotesk-latin-wght-normal.woff2', weight: '300 700', style: 'normal' }],
  variable: '--font-space-grotesk',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'Loadbearing — weigh training claims against the evidence', template: '%s · Loadbearing' },
  description:
    'A workbench where coaches and sports physiotherapists take apart viral training claims, weigh the evidence as a team and publish plain-language verdicts for athletes.',
  applicationName: 'Loadbearing',
};

export const viewport: Viewport = {
  themeColor: '#274a41',
  width: 'device-width',
  initialScale: 1,
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${inter.variable} ${spaceGrotesk.variable}`}>
      <body className="flex min-h-dvh flex-col">
        <a
          href="#main"
          className="bg-brand sr-only z-50 rounded-md px-4 py-2 font-semibold text-white focus:not-sr-only focus:fixed focus:top-3 focus:left-3"
        >
          Skip to content
        </a>
        <div className="flex flex-1 flex-col">{children}</div>
        <SiteFooter />
      </body>
    </html>
  );
}

import type { Metadata, Viewport } from 'next';
import { fontVariables } from '@/components/layout/fonts';
import { SiteFooter } from '@/components/layout/SiteFooter';
import { SkipLink } from '@/components/layout/SkipLink';
import './globals.css';

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
    <html lang="en" className={fontVariables}>
      <body className="flex min-h-dvh flex-col">
        <SkipLink />
        <div className="flex flex-1 flex-col">{children}</div>
        <SiteFooter />
      </body>
    </html>
  );
}

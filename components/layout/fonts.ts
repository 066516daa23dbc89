import localFont from 'next/font/local';

// Shipped with the app (app/fonts, SIL Open Font License) so a machine without network renders the
// same. One definition for both routers: the App Router's root layout and the verdict pages' _app.
export const inter = localFont({
  src: [
    { path: '../../app/fonts/inter-latin-wght-normal.woff2', weight: '100 900', style: 'normal' },
    { path: '../../app/fonts/inter-latin-wght-italic.woff2', weight: '100 900', style: 'italic' },
  ],
  variable: '--font-inter',
  display: 'swap',
});

export const spaceGrotesk = localFont({
  src: [{ path: '../../app/fonts/space-grotesk-latin-wght-normal.woff2', weight: '300 700', style: 'normal' }],
  variable: '--font-space-grotesk',
  display: 'swap',
});

export const fontVariables = `${inter.variable} ${spaceGrotesk.variable}`;

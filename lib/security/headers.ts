/**
 * Security headers of every response (OWASP Secure Headers Project; MDN's CSP reference).
 * Pages with React get a Content-Security-Policy with a fresh nonce per request (proxy.ts), which
 * Next puts on every script it writes; everything else (API answers, files, the script-free
 * verdict page) gets STRICT_POLICY, under which no script runs at all. next.config.ts sends the
 * rest everywhere.
 */

const isProduction = () => process.env.NODE_ENV === 'production';

/** Shared parts: no framing by other sites, no plugins, forms and <base> only to us. */
const COMMON = [
  "default-src 'self'",
  "base-uri 'none'",
  "object-src 'none'",
  "frame-ancestors 'none'",
  "form-action 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  // next/font and React write inline style attributes; styles cannot run code.
  "style-src 'self' 'unsafe-inline'",
  "connect-src 'self'",
];

/** For pages that run Next's scripts: only those carrying this request's nonce, and what they load. */
export function pagePolicy(nonce: string): string {
  // The development server evaluates modules with eval() for fast refresh; a build never does.
  const dev = isProduction() ? '' : " 'unsafe-eval'";
  return [...COMMON, `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev}`].join('; ');
}

/** For everything that needs no script: API answers, files, the verdict page. */
export const STRICT_POLICY = [...COMMON, "script-src 'none'"].join('; ');

/** Sent with every response. */
export function staticSecurityHeaders(): { key: string; value: string }[] {
  const headers = [
    { key: 'X-Content-Type-Options', value: 'nosniff' },
    { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
    // For browsers without CSP frame-ancestors.
    { key: 'X-Frame-Options', value: 'DENY' },
    { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
  ];
  if (isProduction() && process.env.COOKIE_SECURE !== 'false') {
    // Only where the site is served over https (a build run over plain http for tests sets COOKIE_SECURE=false).
    headers.push({ key: 'Strict-Transport-Security', value: 'max-age=31536000; includeSubDomains' });
  }
  return headers;
}

/** A random nonce for one response (128 bits, base64). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

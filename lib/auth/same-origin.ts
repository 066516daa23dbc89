import { AppError, forbidden } from '@/lib/api/errors';

/**
 * Cross-site request refusal (OWASP CSRF Prevention Cheat Sheet: "verifying origin with standard
 * headers" and Fetch Metadata). A browser names the page that sent a request in `Origin` and, in
 * current browsers, how it relates to ours in `Sec-Fetch-Site`; a request that changes something
 * and comes from another site is refused, whatever cookie it carries. Requests without either
 * header (curl, server-to-server) are not from a browser page and pass; the session cookie is
 * also SameSite=Lax (lib/auth/session.ts).
 */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export function isSafeMethod(method: string): boolean {
  return SAFE_METHODS.has(method.toUpperCase());
}

/** The origins this app answers as: its own Host (as the browser saw it) and APP_URL. */
function ownOrigins(headers: Headers, url: string, appUrl: string | undefined): Set<string> {
  const origins = new Set<string>([new URL(url).origin]);
  if (appUrl) origins.add(new URL(appUrl).origin);
  const host = headers.get('x-forwarded-host') ?? headers.get('host');
  if (host) {
    const proto = headers.get('x-forwarded-proto') ?? new URL(url).protocol.replace(':', '');
    origins.add(`${proto}://${host}`);
  }
  return origins;
}

/** Null when the request may go on; otherwise why it is refused. */
export function crossSiteReason(method: string, headers: Headers, url: string, appUrl?: string): string | null {
  if (isSafeMethod(method)) return null;
  const site = headers.get('sec-fetch-site');
  if (site && site !== 'same-origin' && site !== 'none') return `Sec-Fetch-Site: ${site}`;
  const origin = headers.get('origin');
  if (origin && !ownOrigins(headers, url, appUrl).has(origin)) return `Origin: ${origin}`;
  return null;
}

export function crossSiteRefusal(): AppError {
  return forbidden('This request came from another site, so it was refused.');
}

/**
 * The body's declared type must be what the route reads: JSON, or multipart for the documented
 * uploads. A cross-site form can only send text/plain, urlencoded or multipart without a preflight.
 */
export function assertContentType(headers: Headers, expected: 'json' | 'multipart'): void {
  const type = (headers.get('content-type') ?? '').toLowerCase();
  const ok = expected === 'json' ? /^application\/json\s*(;|$)/.test(type) : /^multipart\/form-data\s*;/.test(type);
  if (!ok) {
    throw new AppError(
      'unsupported_media_type',
      expected === 'json' ? 'Send the request body as application/json.' : 'Send the upload as multipart/form-data.',
    );
  }
}

/** Whether the request carries a body at all. */
export function hasBody(headers: Headers): boolean {
  const length = headers.get('content-length');
  return (length !== null && length !== '0') || headers.has('transfer-encoding');
}

import { NextResponse, type NextRequest } from 'next/server';
import { crossSiteReason } from '@/lib/auth/same-origin';
import { SESSION_COOKIE } from '@/lib/auth/session';
import { newNonce, pagePolicy } from '@/lib/security/headers';

const VERDICT_PAGE = /^\/v\/([a-z0-9-]{1,100})$/;
const APP_PAGES = /^\/(dashboard|team|reviews|library|search|verdicts)(\/|$)/;

/**
 * Cheap decisions made before any page renders, looking only at headers and the session cookie
 * (every page, handler and action still checks the session itself):
 * - a page's server action posted from another site is refused with 403 (Next would throw, a 500);
 * - every page gets a Content-Security-Policy with a fresh nonce, which Next puts on its scripts;
 * - a verdict page asked for with a session goes to its per-reader page (team-only verdicts,
 *   signed-in header); without one it stays on the cached public page, which this never touches;
 * - signed-out visitors of app pages go to /sign-in.
 */
export function proxy(request: NextRequest) {
  if (crossSiteReason(request.method, request.headers, request.url, process.env.APP_URL)) {
    return NextResponse.json({ error: 'This request came from another site, so it was refused.' }, { status: 403 });
  }
  const nonce = newNonce();
  const policy = pagePolicy(nonce);
  const headers = new Headers(request.headers);
  headers.set('x-nonce', nonce);
  headers.set('content-security-policy', policy);
  const withPolicy = (response: NextResponse) => {
    response.headers.set('content-security-policy', policy);
    return response;
  };

  const signedIn = request.cookies.has(SESSION_COOKIE);
  const { pathname } = request.nextUrl;
  const verdict = VERDICT_PAGE.exec(pathname);
  if (verdict) {
    if (!signedIn) return withPolicy(NextResponse.next({ request: { headers } }));
    const url = request.nextUrl.clone();
    url.pathname = `/v/${verdict[1]}/signed-in`;
    return withPolicy(NextResponse.rewrite(url, { request: { headers } }));
  }
  if (signedIn || !APP_PAGES.test(pathname)) return withPolicy(NextResponse.next({ request: { headers } }));
  const url = request.nextUrl.clone();
  url.pathname = '/sign-in';
  url.search = `?next=${encodeURIComponent(pathname + request.nextUrl.search)}`;
  return NextResponse.redirect(url);
}

export const config = {
  matcher: [
    // Every page (not the API, whose wrapper refuses cross-site requests itself, and not files).
    '/((?!api/|_next/static|_next/image|fonts/|favicon|v/[^/]+$).*)',
    // Only requests carrying the session cookie (SESSION_COOKIE; the matcher must be a literal):
    // public readers of a verdict skip the proxy entirely.
    { source: '/v/:slug', has: [{ type: 'cookie', key: 'loadbearing_session' }] },
  ],
};

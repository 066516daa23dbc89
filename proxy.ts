import { NextResponse, type NextRequest } from 'next/server';
import { SESSION_COOKIE } from '@/lib/auth/session';

const VERDICT_PAGE = /^\/v\/([a-z0-9-]{1,100})$/;

/**
 * Two cheap decisions made before any page renders, looking only for the session cookie (every
 * page, handler and action still checks the session itself):
 * - a verdict page asked for with a session goes to its per-reader page (team-only verdicts,
 *   signed-in header); without one it stays on the cached public page, which this never touches;
 * - signed-out visitors of app pages go to /sign-in.
 */
export function proxy(request: NextRequest) {
  const signedIn = request.cookies.has(SESSION_COOKIE);
  const verdict = VERDICT_PAGE.exec(request.nextUrl.pathname);
  if (verdict) {
    if (!signedIn) return NextResponse.next();
    const url = request.nextUrl.clone();
    url.pathname = `/v/${verdict[1]}/signed-in`;
    return NextResponse.rewrite(url);
  }
  if (signedIn) return NextResponse.next();
  const url = request.nextUrl.clone();
  url.pathname = '/sign-in';
  url.search = `?next=${encodeURIComponent(request.nextUrl.pathname + request.nextUrl.search)}`;
  return NextResponse.redirect(url);
}

export const config = {
  matcher: [
    '/dashboard/:path*',
    '/team/:path*',
    '/reviews/:path*',
    '/library/:path*',
    '/search/:path*',
    '/verdicts/:path*',
    // Only requests carrying the session cookie (SESSION_COOKIE; the matcher must be a literal):
    // public readers of a verdict skip the proxy entirely.
    { source: '/v/:slug', has: [{ type: 'cookie', key: 'loadbearing_session' }] },
  ],
};

import { NextResponse, type NextRequest } from 'next/server';
import { SESSION_COOKIE } from '@/lib/auth/session';

/**
 * A first, cheap gate: signed-out visitors of app pages go to /sign-in. It only looks for the
 * cookie; every page, handler and action still checks the session itself.
 */
export function proxy(request: NextRequest) {
  if (request.cookies.has(SESSION_COOKIE)) return NextResponse.next();
  const url = request.nextUrl.clone();
  url.pathname = '/sign-in';
  url.search = `?next=${encodeURIComponent(request.nextUrl.pathname + request.nextUrl.search)}`;
  return NextResponse.redirect(url);
}

export const config = {
  matcher: ['/dashboard/:path*', '/team/:path*', '/reviews/:path*', '/library/:path*', '/search/:path*', '/verdicts/:path*'],
};

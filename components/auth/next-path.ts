/**
 * Where to go after signing in: only a path on this site. Anything that could leave it
 * (`//evil.test`, `/\evil.test`, `https://…`, `javascript:`) falls back to the dashboard, so a
 * crafted sign-in link cannot send someone elsewhere.
 */
export function safeNextPath(next: unknown, fallback = '/dashboard'): string {
  if (typeof next !== 'string' || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\'))
    return fallback;
  try {
    const base = 'http://loadbearing.invalid';
    const url = new URL(next, base);
    if (url.origin !== base) return fallback;
    return `${url.pathname}${url.search}${url.hash}`;
  } catch {
    return fallback;
  }
}

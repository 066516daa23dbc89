/**
 * What shared caches (the nginx in front, any CDN) may keep of a signed-out verdict page, and
 * so how long a withdrawn verdict can still be served from one (docs/deployment.md).
 *
 * - `Cache-Control: public, max-age=0, s-maxage=1`: browsers keep nothing and revalidate with
 *   the ETag; a shared cache keeps the page one second.
 * - `X-Accel-Expires: @<second>`: nginx (deploy/nginx/loadbearing.conf) counts a copy's life in
 *   whole seconds of its clock, so "1 s" alone could keep a copy almost 2 s; an absolute expiry
 *   at the end of the second the page was rendered in keeps it at most 1 s. nginx strips this
 *   header before passing the page on.
 *
 * A change therefore shows to every reader within one second plus one render.
 */
export const SHARED_CACHE_SECONDS = 1;

export const PUBLIC_VERDICT_CACHE_CONTROL = `public, max-age=0, s-maxage=${SHARED_CACHE_SECONDS}`;

export function publicVerdictCacheHeaders(now = Date.now()): Record<string, string> {
  return {
    'Cache-Control': PUBLIC_VERDICT_CACHE_CONTROL,
    'X-Accel-Expires': `@${Math.floor(now / 1000)}`,
  };
}

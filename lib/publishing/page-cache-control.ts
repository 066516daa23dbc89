/**
 * What shared caches (the nginx in front, any CDN) may keep of a signed-out verdict page, and
 * so how long a withdrawn verdict can still be served from one (docs/deployment.md).
 *
 * - `Cache-Control: public, max-age=0, s-maxage=1`: browsers keep nothing and revalidate with
 *   the ETag; a shared cache keeps the page one second.
 * - `X-Accel-Expires: @<second>`: for the nginx in front (deploy/nginx/loadbearing.conf), which
 *   counts a copy's life in whole seconds of its clock, so "1 s" alone could keep a copy almost
 *   2 s. The absolute expiry is the start of the second the render began: the copy is due for
 *   renewal as soon as it is stored, and nginx (proxy_cache_use_stale updating +
 *   proxy_cache_background_update) answers readers with the newest finished render while one
 *   request renders the next in the background. nginx strips this header before passing the page on.
 *
 * A change therefore shows to every reader within about two renders through nginx, and within
 * one second from any other shared cache that honours s-maxage.
 */
export const SHARED_CACHE_SECONDS = 1;

export const PUBLIC_VERDICT_CACHE_CONTROL = `public, max-age=0, s-maxage=${SHARED_CACHE_SECONDS}`;

export function publicVerdictCacheHeaders(now = Date.now()): Record<string, string> {
  return {
    'Cache-Control': PUBLIC_VERDICT_CACHE_CONTROL,
    'X-Accel-Expires': `@${Math.floor(now / 1000)}`,
  };
}

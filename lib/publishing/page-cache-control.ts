/**
 * What shared caches (the nginx in front, any CDN) may keep of a signed-out verdict page, and
 * so how long a withdrawn verdict can still be served from one: `s-maxage` seconds plus one
 * render. Browsers keep nothing (`max-age=0`) and revalidate with the ETag. The bound is stated
 * in docs/deployment.md; the nginx site (deploy/nginx/loadbearing.conf) obeys this header and
 * nothing longer.
 */
export const SHARED_CACHE_SECONDS = 1;

export const PUBLIC_VERDICT_CACHE_CONTROL = `public, max-age=0, s-maxage=${SHARED_CACHE_SECONDS}`;

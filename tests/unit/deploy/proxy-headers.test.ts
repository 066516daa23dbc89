import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// nginx inherits `proxy_set_header` from the server block only into a location that sets none of
// its own (nginx ngx_http_proxy_module, proxy_set_header). One header set in a location silently
// drops the others there: Host becomes the upstream's name, X-Forwarded-For (the address the
// sign-in throttle counts) is not sent, and `Connection: close` ends the kept-alive connections
// to the app.
const conf = readFileSync(path.join(process.cwd(), 'deploy/nginx/loadbearing.conf'), 'utf8').replace(/#.*$/gm, '');

/** The text of each `location … { … }` block (they hold no nested blocks; a quoted pattern may hold braces). */
const LOCATION = /location(?:\s+(?:"[^"]*"|[^\s{"]+))+\s*\{([^}]*)\}/g;
const locations = [...conf.matchAll(LOCATION)].map((m) => m[1]);

describe('the nginx configuration', () => {
  it('sets every header for the app in the server block, none in a location', () => {
    expect(locations.length).toBeGreaterThanOrEqual(2);
    expect(locations.filter((body) => /\bproxy_set_header\b/.test(body))).toEqual([]);
  });

  it('sends the app the client address, the host and kept-alive connections, and compresses itself', () => {
    const server = conf.slice(conf.indexOf('server {')).replace(LOCATION, '');
    for (const header of [
      /proxy_set_header\s+X-Forwarded-For\s+\$remote_addr;/,
      /proxy_set_header\s+Host\s+\$http_host;/,
      /proxy_set_header\s+Connection\s+"";/,
      // The app never spends its CPU on gzip behind the proxy: nginx compresses every answer.
      /proxy_set_header\s+Accept-Encoding\s+"";/,
      /gzip\s+on;/,
    ]) {
      expect(server).toMatch(header);
    }
  });
});

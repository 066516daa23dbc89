import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { trustedProxies } from '@/lib/auth/client-address';
import { createAppServer } from '@/scripts/app-server';

// Behind nginx, the app must keep an idle connection open longer than nginx keeps its idle
// connections to the app; otherwise the app may close one just as nginx sends a request on it,
// and a POST or PATCH then fails with 502 (nginx does not retry non-idempotent requests). nginx's
// default for `keepalive_timeout` in an upstream block is 60 s, Node's `keepAliveTimeout` 5 s
// (nginx ngx_http_upstream_module and Node http documentation).

const NGINX_UPSTREAM_DEFAULT_S = 60;

function upstreamKeepaliveSeconds(): number {
  const conf = readFileSync(path.join(process.cwd(), 'deploy/nginx/loadbearing.conf'), 'utf8');
  const upstream = /upstream\s+\w+\s*\{([^}]*)\}/.exec(conf)?.[1] ?? '';
  const value = /^\s*keepalive_timeout\s+(\d+)(s|m)?\s*;/m.exec(upstream);
  if (!value) return NGINX_UPSTREAM_DEFAULT_S;
  return Number(value[1]) * (value[2] === 'm' ? 60 : 1);
}

describe('npm start behind the proxy', () => {
  it('keeps idle connections open longer than nginx keeps its idle connections to it', () => {
    const server = createAppServer(() => undefined, trustedProxies(''));
    expect(server.keepAliveTimeout).toBeGreaterThan(upstreamKeepaliveSeconds() * 1000);
    expect(server.headersTimeout).toBeGreaterThan(server.keepAliveTimeout);
  });
});

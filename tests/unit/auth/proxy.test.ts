import { NextRequest } from 'next/server';
import { describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '@/lib/auth/session';
import { config, proxy } from '@/proxy';

const request = (path: string, cookie?: string) =>
  new NextRequest(new URL(path, 'http://app.test'), cookie ? { headers: { cookie } } : undefined);
const withSession = `${SESSION_COOKIE}=sealed`;

describe('proxy.ts, the gate before pages render', () => {
  it('its verdict matcher names the real session cookie (the matcher has to be a literal)', () => {
    const verdictMatcher = config.matcher.find((m) => typeof m === 'object');
    expect(verdictMatcher).toEqual({ source: '/v/:slug', has: [{ type: 'cookie', key: SESSION_COOKIE }] });
  });

  it('sends a verdict page asked for with a session to its per-reader page', () => {
    const res = proxy(request('/v/cold-plunges-after-strength', withSession));
    expect(res.headers.get('x-middleware-rewrite')).toBe('http://app.test/v/cold-plunges-after-strength/signed-in');
  });

  it('leaves a verdict page without a session alone, and never rewrites deeper verdict paths', () => {
    expect(proxy(request('/v/cold-plunges-after-strength')).headers.get('x-middleware-next')).toBe('1');
    const versions = proxy(request('/v/cold-plunges-after-strength/versions', withSession));
    expect(versions.headers.get('x-middleware-rewrite')).toBeNull();
  });

  it('sends signed-out visitors of app pages to sign-in and back, and lets signed-in ones through', () => {
    const res = proxy(request('/reviews/7?tab=rounds'));
    expect(res.status).toBe(307);
    expect(res.headers.get('location')).toBe('http://app.test/sign-in?next=%2Freviews%2F7%3Ftab%3Drounds');
    expect(proxy(request('/reviews/7', withSession)).headers.get('x-middleware-next')).toBe('1');
  });
});

import { describe, expect, it } from 'vitest';
import { resolveClientAddress, trustedProxies } from '@/lib/auth/client-address';

describe('client address', () => {
  const none = trustedProxies('');
  const proxy = trustedProxies('10.0.0.5, 192.168.0.0/16');

  it('ignores x-forwarded-for from a peer that is not a trusted proxy', () => {
    expect(resolveClientAddress('203.0.113.9', '1.2.3.4', none)).toBe('203.0.113.9');
    expect(resolveClientAddress('::ffff:203.0.113.9', '1.2.3.4', proxy)).toBe('203.0.113.9');
  });

  it('behind trusted proxies, takes the rightmost hop that is not a proxy', () => {
    expect(resolveClientAddress('10.0.0.5', '198.51.100.7', proxy)).toBe('198.51.100.7');
    // A client that sends its own header cannot choose its address: the proxy appends the real one.
    expect(resolveClientAddress('10.0.0.5', 'evil-choice, 198.51.100.7, 192.168.1.1', proxy)).toBe('198.51.100.7');
  });

  it('falls back to the proxy when the header is missing or garbage', () => {
    expect(resolveClientAddress('10.0.0.5', undefined, proxy)).toBe('10.0.0.5');
    expect(resolveClientAddress('10.0.0.5', 'not-an-ip', proxy)).toBe('10.0.0.5');
  });
});

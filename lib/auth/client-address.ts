import { BlockList, isIP } from 'node:net';

/**
 * The client's address for the sign-in throttle. `x-forwarded-for` is written by whoever sends
 * the request, so it is believed only when the socket's peer is one of TRUSTED_PROXIES (lib/env.ts:
 * addresses or CIDR ranges, comma-separated); then the hops are read from the right, and the first
 * one that is not itself a trusted proxy is the client. Otherwise the socket's address is the client.
 * npm start's server (scripts/start.ts) resolves it once per request and passes it on as the only
 * `x-forwarded-for` the app reads (`forwardedClient`).
 */
export function trustedProxies(list: string): BlockList {
  const blocks = new BlockList();
  for (const entry of list
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean)) {
    const [address, bits] = entry.split('/');
    const type = isIP(address) === 6 ? 'ipv6' : 'ipv4';
    if (!isIP(address)) continue;
    if (bits) blocks.addSubnet(address, Number(bits), type);
    else blocks.addAddress(address, type);
  }
  return blocks;
}

/** `::ffff:10.0.0.1` (an IPv4 peer on a dual-stack socket) is 10.0.0.1. */
function plain(address: string): string {
  return address.replace(/^::ffff:(?=\d+\.\d+\.\d+\.\d+$)/, '');
}

function isTrusted(address: string, proxies: BlockList): boolean {
  const version = isIP(address);
  return version !== 0 && proxies.check(address, version === 6 ? 'ipv6' : 'ipv4');
}

export function resolveClientAddress(
  socketAddress: string | undefined,
  forwardedFor: string | string[] | undefined | null,
  proxies: BlockList,
): string {
  const peer = plain(socketAddress ?? '') || 'unknown';
  if (!isTrusted(peer, proxies)) return peer;
  const header = Array.isArray(forwardedFor) ? forwardedFor.join(',') : (forwardedFor ?? '');
  const hops = header
    .split(',')
    .map((h) => plain(h.trim()))
    .filter(Boolean);
  for (let i = hops.length - 1; i >= 0; i--) {
    if (!isIP(hops[i])) return peer;
    if (!isTrusted(hops[i], proxies)) return hops[i];
  }
  return hops[0] ?? peer;
}

/** The client address the server resolved for this request (see above), from its headers. */
export function forwardedClient(headers: Headers): string {
  return headers.get('x-forwarded-for')?.split(',')[0]?.trim() || 'local';
}

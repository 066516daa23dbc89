import type { AddressInfo } from 'node:net';
import type { IncomingMessage, Server, ServerResponse } from 'node:http';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { leaveTheDoor, WRITES_ADMITTED_AT_ONCE } from '@/lib/api/write-turns';
import { trustedProxies } from '@/lib/auth/client-address';
import { WriteQueue } from '@/lib/write-queue';
import { createAppServer } from '@/scripts/app-server';

// `npm start`'s server lets only a few writes into Next at once (lib/api/write-turns.ts): Next
// costs several milliseconds of CPU per request before the route wrapper can hold it, so a burst
// let in whole delayed every reader. Shown without a clock: a stand-in for Next that holds the
// writes it was given until released, and reads that answer meanwhile.

let server: Server | null = null;
afterEach(() => {
  server?.closeAllConnections();
  server?.close();
  server = null;
});

/** The server on a free port in front of `handle`; its base URL. */
async function serve(handle: (req: IncomingMessage, res: ServerResponse) => unknown, door: WriteQueue) {
  server = createAppServer(handle, trustedProxies(''), door);
  await new Promise<void>((resolve) => server!.listen(0, '127.0.0.1', resolve));
  return `http://127.0.0.1:${(server!.address() as AddressInfo).port}`;
}

/** A stand-in for Next: counts what reached it and holds every write until `release()`. */
function heldNext() {
  let release!: () => void;
  const held = new Promise<void>((resolve) => (release = resolve));
  const reached: string[] = [];
  const handle = async (req: IncomingMessage, res: ServerResponse) => {
    reached.push(`${req.method} ${req.url}`);
    if (req.url === '/slow') leaveTheDoor();
    if (req.method !== 'GET' && !req.headers['content-type']?.startsWith('multipart/')) await held;
    res.setHeader('content-type', 'application/json');
    res.end(JSON.stringify({ reached: reached.length }));
  };
  return { handle, reached, release };
}

const json = { 'content-type': 'application/json' };
const spinEventLoop = async () => {
  for (let i = 0; i < 50; i++) await new Promise((r) => setImmediate(r));
};

describe("npm start's door for writes", () => {
  it('lets WRITES_ADMITTED_AT_ONCE writes into Next and holds the rest, while reads and uploads pass', async () => {
    const next = heldNext();
    const base = await serve(next.handle, new WriteQueue(10_000, WRITES_ADMITTED_AT_ONCE));
    const writes = Array.from({ length: WRITES_ADMITTED_AT_ONCE + 3 }, (_, i) =>
      fetch(`${base}/api/reviews/${i + 1}`, { method: 'PATCH', headers: json, body: '{}' }),
    );
    await vi.waitFor(() => expect(next.reached).toHaveLength(WRITES_ADMITTED_AT_ONCE), { timeout: 10_000 });
    await spinEventLoop();
    expect(next.reached).toHaveLength(WRITES_ADMITTED_AT_ONCE);

    const read = await fetch(`${base}/api/me`);
    expect(read.status).toBe(200);
    const upload = await fetch(`${base}/api/studies/1/file`, { method: 'POST', body: new FormData() });
    expect(upload.status).toBe(200);

    next.release();
    const statuses = (await Promise.all(writes)).map((w) => w.status);
    expect(statuses).toEqual(Array(WRITES_ADMITTED_AT_ONCE + 3).fill(200));
  });

  it('answers 503 with Retry-After and the usual headers to a write that waited too long, and never hands it to Next', async () => {
    const next = heldNext();
    const base = await serve(next.handle, new WriteQueue(1, 1));
    const first = fetch(`${base}/api/reviews/1`, { method: 'PATCH', headers: json, body: '{}' });
    await vi.waitFor(() => expect(next.reached).toHaveLength(1), { timeout: 10_000 });

    const refused = await fetch(`${base}/api/reviews/2`, { method: 'PATCH', headers: json, body: '{}' });
    expect(refused.status).toBe(503);
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThanOrEqual(1);
    expect(refused.headers.get('x-content-type-options')).toBe('nosniff');
    expect(refused.headers.get('content-security-policy')).toContain("script-src 'none'");
    expect((await refused.json()).error).toMatch(/busy/);
    expect(next.reached).toEqual(['PATCH /api/reviews/1']);

    next.release();
    expect((await first).status).toBe(200);
  });

  it('lets the next write in when a slow one leaves the door, or a waiting client goes away', async () => {
    const next = heldNext();
    const door = new WriteQueue(10_000, 1);
    const base = await serve(next.handle, door);
    const slow = fetch(`${base}/slow`, { method: 'POST', headers: json, body: '{}' });
    await vi.waitFor(() => expect(next.reached).toEqual(['POST /slow']), { timeout: 10_000 });
    // The slow write still works (held), yet the next one got in.
    const quick = fetch(`${base}/api/reviews/1`, { method: 'PATCH', headers: json, body: '{}' });
    await vi.waitFor(() => expect(next.reached).toHaveLength(2), { timeout: 10_000 });

    // One more waits behind the quick write, and its client gives up.
    const gaveUp = new AbortController();
    const abandoned = fetch(`${base}/api/reviews/2`, {
      method: 'PATCH',
      headers: json,
      body: '{}',
      signal: gaveUp.signal,
    });
    await vi.waitFor(() => expect(door.waiting).toBe(1), { timeout: 10_000 });
    gaveUp.abort();
    await expect(abandoned).rejects.toThrow();
    await vi.waitFor(() => expect(door.waiting).toBe(0), { timeout: 10_000 });
    const after = fetch(`${base}/api/reviews/3`, { method: 'PATCH', headers: json, body: '{}' });

    next.release();
    expect((await quick).status).toBe(200);
    expect((await after).status).toBe(200);
    expect((await slow).status).toBe(200);
    expect(next.reached).not.toContain('PATCH /api/reviews/2');
  });
});

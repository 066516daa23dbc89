import { beforeEach, describe, expect, it } from 'vitest';
import MemoryCacheHandler from '@/lib/cache/memory-cache-handler.mjs';
import { forgetRenderedPage } from '@/lib/cache/rendered-pages';

// Keys as Next 16 builds them: /<cache dir>/<kind>/<hash of the source route>/$<path>.
const key = (path: string) => `/_rc/PAGES/3f9a/$${path}`;
const page = { kind: 'PAGES', html: '<p>verdict</p>', pageData: {}, status: 200 };

let cache: MemoryCacheHandler;
beforeEach(async () => {
  // One store per process (globalThis, shared with forgetRenderedPage): start every test empty.
  (globalThis as { loadbearingRenderedPages?: Map<string, unknown> }).loadbearingRenderedPages?.clear();
  cache = new MemoryCacheHandler();
  for (const k of ['/v/a', '/v/ab', '/v/a/versions', '/team']) await cache.set(key(k), page, { tags: [] });
});

describe('the in-memory page cache behind next start', () => {
  it('returns what was stored, with when it was stored, and null for a miss', async () => {
    const hit = await cache.get(key('/v/a'));
    expect(hit?.value).toEqual(page);
    expect(hit?.lastModified).toBeGreaterThan(Date.now() - 5_000);
    expect(await cache.get(key('/v/zzz'))).toBeNull();
  });

  it('forgetRenderedPage drops exactly that page, not a longer slug or a page below it', async () => {
    forgetRenderedPage('/v/a');
    expect(await cache.get(key('/v/a'))).toBeNull();
    expect(await cache.get(key('/v/ab'))).not.toBeNull();
    expect(await cache.get(key('/v/a/versions'))).not.toBeNull();
  });

  it('revalidatePath arrives as the tag _N_T_<path> and drops that page; other tags drop the entries carrying them', async () => {
    await cache.revalidateTag(['_N_T_/v/ab']);
    expect(await cache.get(key('/v/ab'))).toBeNull();
    expect(await cache.get(key('/v/a'))).not.toBeNull();
    await cache.set(key('/feed'), page, { tags: ['feed'] });
    await cache.revalidateTag('feed');
    expect(await cache.get(key('/feed'))).toBeNull();
    expect(await cache.get(key('/team'))).not.toBeNull();
  });

  it('storing null removes the entry', async () => {
    await cache.set(key('/team'), null);
    expect(await cache.get(key('/team'))).toBeNull();
  });

  it('keeps at most 1,000 pages, dropping the oldest first', async () => {
    for (let i = 0; i < 1_000; i++) await cache.set(key(`/v/slug-${i}`), page);
    expect(await cache.get(key('/v/a'))).toBeNull(); // among the first stored
    expect(await cache.get(key('/v/slug-0'))).not.toBeNull();
    expect(await cache.get(key('/v/slug-999'))).not.toBeNull();
    await cache.set(key('/v/one-more'), page);
    expect(await cache.get(key('/v/slug-0'))).toBeNull();
    expect(await cache.get(key('/v/one-more'))).not.toBeNull();
  });
});

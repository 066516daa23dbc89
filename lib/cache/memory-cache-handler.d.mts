// Types for memory-cache-handler.mjs (plain JavaScript: Next imports it unbundled).
export default class MemoryCacheHandler {
  constructor(options?: unknown);
  get(key: string): Promise<{ value: unknown; lastModified: number; tags: string[] } | null>;
  set(
    key: string,
    data: unknown,
    ctx?: { tags?: string[]; fetchCache?: boolean; cacheControl?: unknown },
  ): Promise<void>;
  revalidateTag(tags: string | string[]): Promise<void>;
  resetRequestCache(): void;
}

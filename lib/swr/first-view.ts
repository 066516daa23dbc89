'use client';

import { useState } from 'react';
import { useSWRConfig } from 'swr';

/**
 * SWR options for a read the server already rendered into the page (its answer passed as
 * `fallbackData` or in `<SWRConfig value={{ fallback }}>`): no second request for it on mount.
 * The server read it during this very render, so asking again would only cost the request (on
 * the workbench, a second run of the scoring engine while the page is still loading).
 *
 * When this tab's SWR cache already held the resource before the component mounted — a client
 * navigation back to a page seen earlier — the cached copy wins over the server's fallback and
 * may be old, so it is revalidated on mount as usual. Later revalidation (a mutation, focus,
 * reconnect) is unchanged. docs/architecture.md, "The workbench's weight".
 */
export function useFirstViewOptions(key: string | null, fallbackData?: unknown): { revalidateOnMount?: boolean } {
  const { cache, fallback } = useSWRConfig();
  // Read once, at the first render: the mount itself writes the key into the cache.
  const [fromServer] = useState(
    () =>
      key !== null &&
      (fallbackData !== undefined || (fallback as Record<string, unknown> | undefined)?.[key] !== undefined) &&
      cache.get(key)?.data === undefined,
  );
  return fromServer ? { revalidateOnMount: false } : {};
}

import { forgetRenderedPage } from '@/lib/cache/rendered-pages';
import type { Publication, PublishedVersion } from '@/models';
import type { EvidenceChangedDTO } from './types';

/**
 * The verdict page's data, kept in memory per slug and dropped on publish and unpublish (with
 * the rendered public page), so a page view costs no database read and a new version shows on
 * the very next request. On globalThis because Next bundles route handlers and pages
 * separately: both must see one cache (one Node process, like the sign-in throttle). Each entry
 * is immutable data.
 */
export interface CachedPublication {
  publication: Pick<
    Publication,
    'id' | 'reviewId' | 'teamId' | 'slug' | 'visibility' | 'latestNumber' | 'withdrawnAt' | 'withdrawnReason'
  >;
  versions: Pick<PublishedVersion, 'number' | 'createdAt' | 'changeNote' | 'publishedById' | 'snapshot'>[];
  publisherNames: Map<number, string>;
  /** Notices on studies the latest version cites (lib/watch/flags.ts); dropped with the rest. */
  evidenceChanged?: EvidenceChangedDTO[];
}

const store = globalThis as unknown as { loadbearingVerdictCache?: Map<string, CachedPublication> };
const cache = () => (store.loadbearingVerdictCache ??= new Map());

export function cachedPublication(slug: string): CachedPublication | undefined {
  return cache().get(slug);
}

export function rememberPublication(slug: string, value: CachedPublication): void {
  // A bound: a team publishes a handful a week, but a crawler can ask for many slugs.
  if (cache().size > 2000) cache().clear();
  cache().set(slug, value);
}

/** After publish, unpublish or delete: the data and the rendered public page go together. */
export function forgetPublication(slug: string): void {
  cache().delete(slug);
  forgetRenderedPage(`/v/${slug}`);
}

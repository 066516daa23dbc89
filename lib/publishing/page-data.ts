import { cache } from 'react';
import { currentActor } from '@/lib/auth/current';
import { findVerdictPage } from './queries';

/**
 * The verdict page's data for this request's reader in App Router pages (once per render:
 * metadata and page share it), or null when it does not exist or is not theirs to read.
 */
export const readVerdict = cache(async (slug: string, version?: number) =>
  findVerdictPage(slug, await currentActor(), version),
);

import { cache } from 'react';
import { AppError } from '@/lib/api/errors';
import { currentActor } from '@/lib/auth/current';
import { verdictPage } from './queries';
import type { VerdictPageDTO } from './types';

const SLUG = /^[a-z0-9-]{1,100}$/;

/**
 * The verdict page's data for this request's reader (once per render: metadata and page share
 * it), or null when it does not exist or is not theirs to read — the page then answers 404.
 */
export const readVerdict = cache(async (slug: string, version?: number): Promise<VerdictPageDTO | null> => {
  if (!SLUG.test(slug)) return null;
  if (version !== undefined && !(Number.isInteger(version) && version > 0)) return null;
  try {
    return await verdictPage(slug, await currentActor(), version);
  } catch (error) {
    if (error instanceof AppError && error.status === 404) return null;
    throw error;
  }
});
